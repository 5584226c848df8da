/**
 * Output safety of `tileflux run`: --force replaces only folders tileflux wrote, concurrent runs
 * never lose a result silently, interrupted runs leave either the old or the new folder, and
 * environment errors are one-line user errors.
 */
import { spawnSync } from 'node:child_process';
import {
  copyFileSync,
  existsSync,
  mkdirSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  rmSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CLI, ensureBuilt, FIELD, tileflux, WEATHER } from './cli.js';
import { action } from '../../src/cli/common.js';
import { cleanStale, writeDirAtomic, RUN_MARKER } from '../../src/io/atomicOutput.js';

const QUICK = ['--no-charts', '--no-report'];
let dir: string;

/** `run` of the demo field for one year into `out`. */
function runYear(year: number, out: string, ...extra: string[]) {
  return [
    'run',
    FIELD,
    '-w',
    WEATHER,
    '--from',
    `${year}-01-01`,
    '--to',
    `${year}-12-31`,
    '--out',
    out,
    ...QUICK,
    ...extra,
  ];
}

/** A pid that is surely not running: a child that has already exited. */
function deadPid(): number {
  const r = spawnSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))'], {
    encoding: 'utf8',
  });
  return Number(r.stdout);
}

/** The reported first year of a complete run folder, or why it is not complete. */
function folderYear(out: string): number | string {
  for (const f of ['daily.csv', 'annual.csv', 'comparison.csv', 'summary.json', RUN_MARKER]) {
    if (!existsSync(join(out, f))) return `missing ${f}`;
  }
  const s = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8'));
  const days = readFileSync(join(out, 'daily.csv'), 'utf8').trim().split('\n').length - 1;
  const year = Number(s.period.from.slice(0, 4));
  const expected = 3 * (year % 4 === 0 ? 366 : 365);
  return days === expected ? year : `daily.csv has ${days} rows, expected ${expected}`;
}

beforeAll(() => {
  ensureBuilt();
  dir = mkdtempSync(join(tmpdir(), 'tileflux-safety-'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('--force replaces only folders tileflux wrote', () => {
  it('refuses the working folder and keeps the user’s files', () => {
    const work = join(dir, 'work');
    mkdirSync(work);
    copyFileSync(FIELD, join(work, 'field.yaml'));
    copyFileSync(WEATHER, join(work, 'weather.csv'));
    writeFileSync(join(work, 'notes.txt'), 'my notes\n');
    const r = tileflux(
      ['run', 'field.yaml', '-w', 'weather.csv', '--out', '.', '--force', '--from', '2001-01-01'],
      { cwd: work },
    );
    expect(r.code).toBe(1);
    expect(r.stderr).toBe(
      'tileflux: error: will not replace output folder .: it is or holds the working folder; tileflux replaces only folders it wrote itself; choose another --out\n',
    );
    expect(readdirSync(work).sort()).toEqual(['field.yaml', 'notes.txt', 'weather.csv']);
    // An empty --out (e.g. an unset shell variable) would mean the working folder.
    const e = tileflux(['run', 'field.yaml', '-w', 'weather.csv', '--out', '', '--force'], {
      cwd: work,
    });
    expect(e.stderr).toBe('tileflux: error: --out is empty; give the name of the output folder\n');
    expect(readdirSync(work).sort()).toEqual(['field.yaml', 'notes.txt', 'weather.csv']);
  });

  it('refuses a folder holding an input file, a folder it did not write, and a file', () => {
    const proj = join(dir, 'proj');
    mkdirSync(proj);
    copyFileSync(FIELD, join(proj, 'field.yaml'));
    // A summary.json of ours in the folder does not make the field file in it replaceable.
    writeFileSync(join(proj, 'summary.json'), '{"tool": {"name": "tileflux"}}');
    const r = tileflux([
      'run',
      join(proj, 'field.yaml'),
      '-w',
      WEATHER,
      '--out',
      proj,
      '--force',
      ...QUICK,
    ]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/it holds the input file .*field\.yaml; tileflux replaces only/);
    expect(existsSync(join(proj, 'field.yaml'))).toBe(true);

    const mine = join(dir, 'mine');
    mkdirSync(mine);
    writeFileSync(join(mine, 'thesis.txt'), 'years of work\n');
    const m = tileflux(runYear(2001, mine, '--force'));
    expect(m.code).toBe(1);
    expect(m.stderr).toMatch(
      /will not replace output folder .*mine: it was not written by tileflux \(no \.tileflux-run marker/,
    );
    expect(readFileSync(join(mine, 'thesis.txt'), 'utf8')).toBe('years of work\n');

    const file = join(dir, 'afile');
    writeFileSync(file, 'keep\n');
    const f = tileflux(runYear(2001, file, '--force'));
    expect(f.stderr).toMatch(/afile: it is a file, not a folder; choose another --out\n$/);
    expect(readFileSync(file, 'utf8')).toBe('keep\n');
  });

  it('refuses the home folder and the root without touching them', async () => {
    const home = join(dir, 'home');
    mkdirSync(home);
    writeFileSync(join(home, '.profile'), 'x');
    const saved = process.env.HOME;
    process.env.HOME = home;
    try {
      const none = () => {
        throw new Error('fill must not run');
      };
      await expect(writeDirAtomic(home, true, none)).rejects.toThrow(
        /it is your home folder; tileflux replaces only folders it wrote itself/,
      );
      await expect(writeDirAtomic('/', true, none)).rejects.toThrow(/it is the root folder/);
    } finally {
      process.env.HOME = saved;
    }
    expect(readdirSync(home)).toEqual(['.profile']);
  });

  it('replaces a folder it wrote, also one from before the marker (our summary.json)', () => {
    const out = join(dir, 'legacy');
    mkdirSync(out);
    writeFileSync(join(out, 'summary.json'), '{"tool": {"name": "tileflux", "version": "0.1.0"}}');
    const r = tileflux(runYear(2001, out, '--force'));
    expect(r.stderr).toBe('');
    expect(folderYear(out)).toBe(2001);
  });

  it('makes the output folder with the usual permissions (umask), like charts/', () => {
    const out = join(dir, 'mode');
    expect(tileflux(runYear(2001, out)).code).toBe(0);
    const ref = join(dir, 'mode-ref');
    mkdirSync(ref);
    expect(statSync(out).mode & 0o777).toBe(statSync(ref).mode & 0o777);
  });
});

describe('concurrent runs', () => {
  it('a run that finds the folder written meanwhile exits 1 and keeps the other result', async () => {
    const out = join(dir, 'race');
    await expect(
      writeDirAtomic(out, false, async (tmp) => {
        writeFileSync(join(tmp, 'mine.txt'), 'loser\n');
        // The other run finishes first.
        await writeDirAtomic(out, false, (t) => writeFileSync(join(t, 'theirs.txt'), 'winner\n'));
      }),
    ).rejects.toThrow(
      /another run wrote output folder .*race while this one ran; it was kept and this run's result discarded/,
    );
    expect(readdirSync(out).sort()).toEqual([RUN_MARKER, 'theirs.txt']);
    expect(readdirSync(dir).filter((e) => e.startsWith('.race'))).toEqual([]);
  });

  it('a lock held by a live run is an error naming that process', () => {
    const out = join(dir, 'locked');
    writeFileSync(join(dir, '.locked.lock'), String(process.pid));
    const r = tileflux(runYear(2001, out));
    expect(r.code).toBe(1);
    expect(r.stderr).toBe(
      `tileflux: error: another tileflux run (process ${process.pid}) is writing output folder ${out}; nothing was replaced, run again when it has finished or choose another --out\n`,
    );
    expect(existsSync(out)).toBe(false);
    expect(readdirSync(dir).filter((e) => e.startsWith('.locked.tmp'))).toEqual([]);
    // A lock left by a dead process is removed by the next run.
    writeFileSync(join(dir, '.locked.lock'), String(deadPid()));
    expect(tileflux(runYear(2001, out)).code).toBe(0);
    expect(existsSync(join(dir, '.locked.lock'))).toBe(false);
  });
});

describe('interrupted runs', () => {
  it('removes stale temporaries of dead processes on the next run to the same folder', () => {
    const parent = join(dir, 'stale');
    mkdirSync(parent);
    const dead = deadPid();
    mkdirSync(join(parent, `.out.tmp-${dead}-0badf00d`));
    mkdirSync(join(parent, `.out.tmp-${process.pid}-00c0ffee`)); // a live writer's: kept
    mkdirSync(join(parent, `out.old-${dead}`)); // the naming of older versions
    mkdirSync(join(parent, '.other.tmp-1-ab')); // another folder's: kept
    expect(tileflux(runYear(2001, join(parent, 'out'))).code).toBe(0);
    expect(readdirSync(parent).sort()).toEqual([
      '.other.tmp-1-ab',
      `.out.tmp-${process.pid}-00c0ffee`,
      'out',
    ]);
  });

  it('SIGTERM while writing removes the temporary folder and the lock', () => {
    const parent = join(dir, 'term');
    mkdirSync(parent);
    const r = tileflux(runYear(2001, join(parent, 'out')), {
      env: { TILEFLUX_TEST_KILL_AT: 'temp-created:SIGTERM' },
    });
    expect(r.code).toBe(143);
    expect(r.stderr).toBe('tileflux: stopped by SIGTERM; nothing was written\n');
    expect(readdirSync(parent)).toEqual([]);
  });

  // The replace sequence is documented at writeDirAtomic (src/io/atomicOutput.ts). A SIGKILL after
  // each of its steps must leave under the name either the old complete folder or the new one;
  // after the two renames' gap ('old-moved') the old one is complete beside it and the next run
  // to the folder puts it back. Either way the next run leaves no temporaries behind.
  it.each(['temp-created', 'temp-filled', 'locked', 'old-moved', 'new-in-place', 'old-removed'])(
    'a kill at step %s leaves the old or the new folder complete',
    (step) => {
      const parent = join(dir, `kill-${step}`);
      const out = join(parent, 'out');
      expect(tileflux(runYear(2001, out)).code).toBe(0);
      const r = tileflux(runYear(2002, out, '--force'), {
        env: { TILEFLUX_TEST_KILL_AT: step },
      });
      expect(r.signal).toBe('SIGKILL');
      const expectNew = step === 'new-in-place' || step === 'old-removed';
      if (step === 'old-moved') {
        expect(existsSync(out)).toBe(false);
        const moved = readdirSync(parent).filter((e) => e.startsWith('.out.old-'));
        expect(moved.length).toBe(1);
        expect(folderYear(join(parent, moved[0]))).toBe(2001);
        // The next run to the folder restores the old one before deciding anything.
        const again = tileflux(runYear(2003, out));
        expect(again.stderr).toMatch(/already exists; use --force to replace it/);
        expect(folderYear(out)).toBe(2001);
      } else {
        expect(folderYear(out)).toBe(expectNew ? 2002 : 2001);
      }
      expect(tileflux(runYear(2003, out, '--force')).code).toBe(0);
      expect(folderYear(out)).toBe(2003);
      expect(readdirSync(parent)).toEqual(['out']);
    },
  );
});

describe('environment errors are one-line user errors', () => {
  it.each([
    ['/proc/tileflux-x', /^tileflux: error: cannot write output folder \/proc\/tileflux-x: /],
    [
      '/dev/null/x',
      /^tileflux: error: cannot write output folder \/dev\/null\/x: \/dev\/null is a file, not a folder\n$/,
    ],
    [
      'a'.repeat(300),
      /^tileflux: error: cannot write output folder a{77}\.\.\. \(300 characters\): a name in the path is too long/,
    ],
  ])('--out %s', (out, expected) => {
    const r = tileflux(runYear(2001, out), { cwd: dir });
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(expected);
    expect(r.stderr.split('\n').length).toBe(2);
  });

  it('a full disk or file-size limit (EFBIG) is a user error, with nothing left behind', () => {
    const parent = join(dir, 'big');
    mkdirSync(parent);
    const r = spawnSync(
      'bash',
      ['-c', `ulimit -f 64; exec "${process.execPath}" "$@"`, 'bash', CLI, ...runYear(2001, 'o')],
      { encoding: 'utf8', cwd: parent },
    );
    expect(r.status).toBe(1);
    expect(r.stderr).toBe(
      'tileflux: error: cannot write output folder o: the file is larger than the file system or the file-size limit (ulimit -f) allows\n',
    );
    expect(readdirSync(parent)).toEqual([]);
  });

  it('ENOSPC and the other file-system codes thrown anywhere map to one line, exit 1', async () => {
    const saved = { write: process.stderr.write, code: process.exitCode };
    let text = '';
    process.stderr.write = ((s: string) => ((text += s), true)) as typeof process.stderr.write;
    try {
      for (const code of ['ENOSPC', 'EROFS', 'EACCES', 'ENOENT', 'EEXIST', 'ENOTDIR']) {
        text = '';
        process.exitCode = 0;
        await action(() => {
          throw Object.assign(new Error(`${code}: x`), { code, path: '/data/out/daily.csv' });
        })();
        expect(process.exitCode).toBe(1);
        expect(text).toMatch(/^tileflux: error: \/data\/out\/daily\.csv: [a-z][^\n]+\n$/);
      }
    } finally {
      process.stderr.write = saved.write;
      process.exitCode = saved.code;
    }
  });

  it('a YAML alias bomb is refused by the resource guard with a one-line error', () => {
    const lines = ['a0: &a0 [x, x, x, x, x, x, x, x, x]'];
    for (let i = 1; i < 9; i++) lines.push(`a${i}: &a${i} [${Array(9).fill(`*a${i - 1}`)}]`);
    const bomb = join(dir, 'bomb.yaml');
    writeFileSync(bomb, lines.join('\n') + '\nname: x\n');
    const r = tileflux(['run', bomb, '-w', WEATHER]);
    expect(r.code).toBe(1);
    expect(r.stderr).toBe(
      `tileflux: error: ${bomb}: YAML aliases (*name) expand to too many values (the resource guard against alias bombs); write the values out or use fewer aliases\n`,
    );
  });
});

describe('cleanStale', () => {
  it('moves a complete old folder of a dead run back when the name is free', () => {
    const parent = join(dir, 'restore');
    mkdirSync(parent);
    const old = join(parent, `.out.old-${deadPid()}`);
    mkdirSync(old);
    writeFileSync(join(old, RUN_MARKER), '');
    cleanStale(parent, 'out');
    expect(readdirSync(parent)).toEqual(['out']);
  });
});
