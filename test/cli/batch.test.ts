/**
 * `tileflux batch`: shards that add up to the unsharded run, Parquet read back through DuckDB
 * and checked against `tileflux run`'s own comparison.csv and annual.csv, a broken job that does
 * not stop the others, --resume that keeps finished jobs without reading their inputs again, and
 * located errors for bad manifest rows. The reference for the values is the `run` command on the
 * same field and weather (a batch job must be that run, row for row). Short weather keeps it fast:
 * the first four years of the demo record (one warm-up year, three reported).
 */
import {
  copyFileSync,
  existsSync,
  mkdirSync,
  mkdtempSync,
  readFileSync,
  readdirSync,
  rmSync,
  writeFileSync,
} from 'node:fs';
import { spawn } from 'node:child_process';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DuckDBInstance, type DuckDBConnection } from '@duckdb/node-api';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { toCsv } from '../../src/io/tables.js';
import { CLI, FIELD, tileflux, WEATHER } from './cli.js';

let dir: string;
let db: DuckDBInstance;
let con: DuckDBConnection;

/** The first `years` years of the demo weather record (1991 on). */
function shortWeather(path: string, years: number): void {
  const lines = readFileSync(WEATHER, 'utf8').split('\n');
  const last = `${1991 + years - 1}-12-31`;
  const end = lines.findIndex((l) => l.startsWith(last));
  writeFileSync(path, lines.slice(0, end + 1).join('\n') + '\n');
}

const MANIFEST = [
  'id,field,weather,scenarios,drains.spacing,soil.conductivity',
  'as-given,field.yaml,w4.csv,,,',
  'spacing-14,field.yaml,w4.csv,conventional;controlled,14 m,',
  'tight-24,field.yaml,w4.csv,controlled,24 m,0.5 m/d',
  'open-30,field.yaml,w4.csv,,30 m,1.4 m/d',
  'other-weather,field.yaml,w5.csv,conventional,,',
  'spacing-20,field.yaml,w4.csv,shallow;conventional,20 m,',
].join('\n');

const batch = (args: string[], env: Record<string, string> = {}) =>
  tileflux(['batch', ...args], {
    env: { JOB_COMPLETION_INDEX: '', SLURM_ARRAY_TASK_ID: '', ...env },
  });

async function query(sql: string): Promise<Array<Record<string, unknown>>> {
  return (await con.runAndReadAll(sql)).getRowObjects() as Array<Record<string, unknown>>;
}

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'tileflux-batch-'));
  copyFileSync(FIELD, join(dir, 'field.yaml'));
  shortWeather(join(dir, 'w4.csv'), 4);
  shortWeather(join(dir, 'w5.csv'), 5);
  writeFileSync(join(dir, 'jobs.csv'), MANIFEST + '\n');
  db = await DuckDBInstance.create(':memory:');
  con = await db.connect();
});
afterAll(() => {
  con?.closeSync();
  db?.closeSync();
  rmSync(dir, { recursive: true, force: true });
});

describe('tileflux batch: shards and Parquet', () => {
  let whole: string;
  beforeAll(() => {
    whole = join(dir, 'whole');
    const r = batch([join(dir, 'jobs.csv'), '--out', whole, '--workers', '0']);
    expect(r.code, r.stderr).toBe(0);
  });

  it('four shards (flag, Kubernetes and Slurm index) hold exactly the rows of the unsharded run', async () => {
    const out = join(dir, 'sharded');
    const m = join(dir, 'jobs.csv');
    const runs = [
      batch([m, '--out', out, '--shard', '0/4', '--workers', '2']),
      batch([m, '--out', out, '--shards', '4', '--workers', '1'], { JOB_COMPLETION_INDEX: '1' }),
      batch([m, '--out', out, '--shards', '4', '--workers', '0'], { SLURM_ARRAY_TASK_ID: '2' }),
      batch([m, '--out', out, '--shard', '3/4']),
    ];
    for (const r of runs) expect(r.code, r.stderr).toBe(0);
    expect(readdirSync(out).sort()).toEqual(
      [0, 1, 2, 3]
        .flatMap((k) => [`annual-${k}of4.parquet`, `status-${k}of4.csv`, `summary-${k}of4.parquet`])
        .sort(),
    );
    // Rows 0 and 4 (0-based) are shard 0's: index mod 4.
    const ids = await query(
      `SELECT job_id FROM '${out}/summary-0of4.parquet' GROUP BY job_id ORDER BY job_id`,
    );
    expect(ids.map((r) => r.job_id)).toEqual(['as-given', 'other-weather']);
    for (const table of ['annual', 'summary']) {
      const order = table === 'annual' ? 'job_id, scenario, year' : 'job_id, scenario';
      const a = await query(`SELECT * FROM '${out}/${table}-*of4.parquet' ORDER BY ${order}`);
      const b = await query(`SELECT * FROM '${whole}/${table}-0of1.parquet' ORDER BY ${order}`);
      expect(a.length).toBeGreaterThan(0);
      expect(a).toEqual(b);
    }
    // 3 + 2 + 1 + 3 + 1 + 2 scenarios; three reported years on w4, four on w5.
    const n = await query(`SELECT count(*)::INTEGER AS n FROM '${out}/summary-*.parquet'`);
    expect(n[0].n).toBe(12);
    const y = await query(`SELECT count(*)::INTEGER AS n FROM '${out}/annual-*.parquet'`);
    expect(y[0].n).toBe(11 * 3 + 1 * 4);
  });

  it('writes typed columns, and a query gives back comparison.csv and annual.csv of tileflux run', async () => {
    const types = await query(`DESCRIBE SELECT * FROM '${whole}/summary-0of1.parquet'`);
    const typeOf = Object.fromEntries(types.map((t) => [t.column_name, t.column_type]));
    expect(typeOf).toMatchObject({
      job_id: 'VARCHAR',
      scenario: 'VARCHAR',
      is_baseline: 'BOOLEAN',
      years: 'INTEGER',
      drainflow_mm: 'DOUBLE',
      no3n_load_change_percent: 'DOUBLE',
      drainflow_change_percent_low: 'DOUBLE',
    });
    const annualTypes = await query(`DESCRIBE SELECT * FROM '${whole}/annual-0of1.parquet'`);
    expect(
      Object.fromEntries(annualTypes.map((t) => [t.column_name, t.column_type])),
    ).toMatchObject({
      job_id: 'VARCHAR',
      year: 'INTEGER',
      days: 'INTEGER',
      wet_days: 'DOUBLE',
    });

    // The job with a changed spacing against run on a field file with that spacing written in.
    const field14 = join(dir, 'field14.yaml');
    const text = readFileSync(FIELD, 'utf8');
    expect(text).toMatch(/^ {2}spacing: 18 m$/m);
    writeFileSync(field14, text.replace(/^ {2}spacing: 18 m$/m, '  spacing: 14 m'));
    for (const [id, field, scenarios] of [
      ['as-given', join(dir, 'field.yaml'), []],
      ['spacing-14', field14, ['--scenario', 'conventional', 'controlled']],
    ] as const) {
      const out = join(dir, `run-${id}`);
      const r = tileflux([
        'run',
        field,
        '--weather',
        join(dir, 'w4.csv'),
        '--out',
        out,
        '--no-charts',
        '--no-report',
        '--daily',
        'none',
        ...scenarios,
      ]);
      expect(r.code, r.stderr).toBe(0);
      for (const table of ['summary', 'annual']) {
        const rows = await query(
          `SELECT * EXCLUDE (job_id) FROM read_parquet('${whole}/${table}-0of1.parquet', file_row_number = true) WHERE job_id = '${id}' ORDER BY file_row_number`,
        );
        const plain = rows.map((row) => {
          const { file_row_number: _, ...rest } = row;
          return rest as Record<string, string | number>;
        });
        const csv = table === 'summary' ? 'comparison.csv' : 'annual.csv';
        expect(toCsv(plain, 'si'), `${id} ${csv}`).toBe(readFileSync(join(out, csv), 'utf8'));
      }
    }
  });

  it('refuses to overwrite a shard without --resume or --force, and never touches other shards', () => {
    const out = join(dir, 'sharded');
    const before = readFileSync(join(out, 'status-1of4.csv'));
    const r = batch([join(dir, 'jobs.csv'), '--out', out, '--shard', '0/4']);
    expect(r.code).toBe(1);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/annual-0of4\.parquet already exists.*--resume.*--force/);
    const f = batch([join(dir, 'jobs.csv'), '--out', out, '--shard', '0/4', '--force']);
    expect(f.code, f.stderr).toBe(0);
    expect(readFileSync(join(out, 'status-1of4.csv')).equals(before)).toBe(true);
    expect(readdirSync(out).filter((n) => n.startsWith('.'))).toEqual([]);
  });
});

describe('tileflux batch: failures and resume', () => {
  it('a job whose weather record is broken fails alone; the status names it and the error', async () => {
    const d = join(dir, 'broken');
    mkdirSync(d);
    copyFileSync(FIELD, join(d, 'field.yaml'));
    shortWeather(join(d, 'good.csv'), 4);
    const lines = readFileSync(join(d, 'good.csv'), 'utf8').split('\n');
    lines[5] = '1991-01-05,lots,3.0,1.0';
    writeFileSync(join(d, 'bad.csv'), lines.join('\n'));
    writeFileSync(
      join(d, 'jobs.csv'),
      'id,field,weather\nfirst,field.yaml,good.csv\nbroken,field.yaml,bad.csv\nlast,field.yaml,good.csv\n',
    );
    const r = batch([join(d, 'jobs.csv'), '--out', join(d, 'out'), '--json']);
    expect(r.code, r.stderr).toBe(3);
    const report = JSON.parse(r.stdout);
    expect(report).toMatchObject({ jobs: 3, ok: 2, failed: 1 });
    const status = readFileSync(join(d, 'out', 'status-0of1.csv'), 'utf8')
      .trim()
      .split('\n');
    expect(status[0]).toBe('job_id,status,error,seconds,manifest_row_sha256');
    expect(status[1]).toMatch(/^first,ok,,/);
    expect(status[2]).toMatch(/^broken,failed,.*bad\.csv.*line 6.*lots/);
    expect(status[3]).toMatch(/^last,ok,,/);
    const ids = await query(
      `SELECT DISTINCT job_id FROM '${d}/out/summary-0of1.parquet' ORDER BY job_id`,
    );
    expect(ids.map((x) => x.job_id)).toEqual(['first', 'last']);
  });

  it('--resume keeps the jobs marked ok without reading their inputs, and equals an uninterrupted run', async () => {
    const d = join(dir, 'resume');
    mkdirSync(d);
    for (const f of ['a.yaml', 'b.yaml', 'c.yaml']) copyFileSync(FIELD, join(d, f));
    shortWeather(join(d, 'w.csv'), 4);
    writeFileSync(join(d, 'late.csv'), 'date,precip_mm,tmax_c,tmin_c\n1991-01-01,x,1,0\n');
    const manifest =
      'id,field,weather,drains.spacing\na,a.yaml,w.csv,16 m\nb,b.yaml,w.csv,\nc,c.yaml,late.csv,22 m\n';
    writeFileSync(join(d, 'jobs.csv'), manifest);
    const out = join(d, 'out');
    expect(batch([join(d, 'jobs.csv'), '--out', out]).code).toBe(3);
    // The record of c arrives; a and b lose their field files, so running them again would fail.
    copyFileSync(join(d, 'w.csv'), join(d, 'late.csv'));
    rmSync(join(d, 'a.yaml'));
    rmSync(join(d, 'b.yaml'));
    const plain = batch([join(d, 'jobs.csv'), '--out', join(d, 'again'), '--force']);
    expect(plain.code).toBe(1);
    expect(plain.stderr).toMatch(/jobs\.csv: line 2, column 2 \(field\): no such field file/);
    const r = batch([join(d, 'jobs.csv'), '--out', out, '--resume', '--json']);
    expect(r.code, r.stderr).toBe(0);
    expect(JSON.parse(r.stdout)).toMatchObject({
      jobs: 3,
      ok: 3,
      failed: 0,
      kept_from_earlier_run: 2,
    });

    // The same manifest with every input in place, in one go.
    const ref = join(dir, 'resume-ref');
    mkdirSync(ref);
    for (const f of ['a.yaml', 'b.yaml', 'c.yaml']) copyFileSync(FIELD, join(ref, f));
    shortWeather(join(ref, 'w.csv'), 4);
    shortWeather(join(ref, 'late.csv'), 4);
    writeFileSync(join(ref, 'jobs.csv'), manifest);
    expect(batch([join(ref, 'jobs.csv'), '--out', join(ref, 'out')]).code).toBe(0);
    for (const table of ['annual', 'summary']) {
      const a = await query(`SELECT * FROM '${out}/${table}-0of1.parquet'`);
      const b = await query(`SELECT * FROM '${ref}/out/${table}-0of1.parquet'`);
      expect(a.length).toBeGreaterThan(0);
      expect(a).toEqual(b);
    }
    const status = readFileSync(join(out, 'status-0of1.csv'), 'utf8');
    expect(
      status
        .split('\n')
        .slice(1, 4)
        .map((l) => l.split(',').slice(0, 2).join(',')),
    ).toEqual(['a,ok', 'b,ok', 'c,ok']);

    // A row whose cells changed is run again (its recorded result no longer fits): it needs a.yaml.
    writeFileSync(
      join(d, 'jobs.csv'),
      manifest.replace('a,a.yaml,w.csv,16 m', 'a,a.yaml,w.csv,17 m'),
    );
    const changed = batch([join(d, 'jobs.csv'), '--out', out, '--resume']);
    expect(changed.code).toBe(1);
    expect(changed.stderr).toMatch(/line 2, column 2 \(field\): no such field file/);
  });
});

describe('tileflux batch: stopped while running', () => {
  it('SIGTERM records the finished jobs; --resume runs the rest and equals a run in one go', async () => {
    const d = join(dir, 'stopped');
    mkdirSync(d);
    copyFileSync(FIELD, join(d, 'field.yaml'));
    shortWeather(join(d, 'w.csv'), 5);
    const rows = Array.from({ length: 24 }, (_, j) => `j${j},field.yaml,w.csv,${12 + j} m`);
    writeFileSync(
      join(d, 'jobs.csv'),
      ['id,field,weather,drains.spacing', ...rows].join('\n') + '\n',
    );
    const out = join(d, 'out');
    const status = join(out, 'status-0of1.csv');
    const child = spawn(
      process.execPath,
      [CLI, 'batch', join(d, 'jobs.csv'), '--out', out, '--workers', '0'],
      { env: { ...process.env, TILEFLUX_TEST_CHECKPOINT_S: '0', JOB_COMPLETION_INDEX: '' } },
    );
    let stderr = '';
    child.stderr.on('data', (b: Buffer) => (stderr += b.toString()));
    const exited = new Promise<number | null>((r) => child.on('exit', (code) => r(code)));
    // Stop it once the files record a finished job (they are rewritten after every job here).
    const t0 = Date.now();
    while (!(existsSync(status) && /,ok,/.test(readFileSync(status, 'utf8')))) {
      if (Date.now() - t0 > 60_000) throw new Error(`no job finished: ${stderr}`);
      await new Promise((r) => setTimeout(r, 20));
    }
    child.kill('SIGTERM');
    expect(await exited, stderr).toBe(143);
    expect(stderr).toMatch(
      /stopped by SIGTERM; \d+ of 24 jobs of shard 0\/1 are recorded.*--resume/,
    );
    const states = readFileSync(status, 'utf8')
      .trim()
      .split('\n')
      .slice(1)
      .map((l) => l.split(',')[1]);
    const done = states.filter((s) => s === 'ok').length;
    expect(states.filter((s) => s === 'pending').length).toBe(24 - done);
    expect(done).toBeGreaterThan(0);
    expect(done).toBeLessThan(24);
    expect(readdirSync(out).filter((n) => n.startsWith('.'))).toEqual([]);

    const r = batch([join(d, 'jobs.csv'), '--out', out, '--resume', '--json']);
    expect(r.code, r.stderr).toBe(0);
    expect(JSON.parse(r.stdout)).toMatchObject({ jobs: 24, ok: 24, kept_from_earlier_run: done });
    const ref = batch([join(d, 'jobs.csv'), '--out', join(d, 'ref'), '--workers', '2']);
    expect(ref.code, ref.stderr).toBe(0);
    for (const table of ['annual', 'summary']) {
      const a = await query(`SELECT * FROM '${out}/${table}-0of1.parquet'`);
      const b = await query(`SELECT * FROM '${d}/ref/${table}-0of1.parquet'`);
      expect(a.length).toBe(table === 'annual' ? 24 * 3 * 4 : 24 * 3);
      expect(a).toEqual(b);
    }
  });
});

describe('tileflux batch: bad input', () => {
  const cases: Array<[string, string, RegExp]> = [
    [
      'no weather column',
      'id,field\na,field.yaml\n',
      /jobs-x\.csv: line 1: the header has no "weather" column/,
    ],
    [
      'a misspelt field key',
      'id,field,weather,drains.spacng\na,field.yaml,w4.csv,15 m\n',
      /line 1, column 4 \(drains\.spacng\): "drains\.spacng" is not a field-file key; did you mean "drains\.spacing"\?/,
    ],
    [
      'an id used twice',
      'id,field,weather\na,field.yaml,w4.csv\na,field.yaml,w4.csv\n',
      /line 3, column 1 \(id\): the id "a" is already used on line 2/,
    ],
    [
      'an empty weather cell',
      'id,field,weather\na,field.yaml,\n',
      /line 2, column 3 \(weather\): the weather cell is empty/,
    ],
    [
      'a value the schema refuses',
      'id,field,weather,drains.spacing\na,field.yaml,w4.csv,15 m\nb,field.yaml,w4.csv,-3 m\n',
      /line 3, column 4 \(drains\.spacing\): .*spacing/,
    ],
    [
      'a length without a unit the schema cannot read',
      'id,field,weather,soil.conductivity\na,field.yaml,w4.csv,fast\n',
      /line 2, column 4 \(soil\.conductivity\)/,
    ],
    [
      'a missing weather file',
      'id,field,weather\na,field.yaml,w4.csv\nb,field.yaml,nowhere.csv\n',
      /line 3, column 3 \(weather\): no such weather file/,
    ],
    [
      'an unknown scenario',
      'id,field,weather,scenarios\na,field.yaml,w4.csv,conventional;wide\n',
      /line 2, column 4 \(scenarios\): scenario "wide" is not in field\.yaml; it has conventional, shallow, controlled/,
    ],
  ];
  for (const [what, text, message] of cases) {
    it(`stops before running on ${what}, with the line and column`, () => {
      const m = join(dir, 'jobs-x.csv');
      writeFileSync(m, text);
      const out = join(dir, 'bad-out');
      const r = batch([m, '--out', out]);
      expect(r.code, r.stderr).toBe(1);
      expect(r.stdout).toBe('');
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(r.stderr).toMatch(message);
      expect(existsSync(out)).toBe(false);
    });
  }

  it('lists the lines of the other bad rows in the one error line', () => {
    const m = join(dir, 'jobs-y.csv');
    writeFileSync(
      m,
      'id,field,weather\na,field.yaml,x1.csv\nb,field.yaml,w4.csv\nc,field.yaml,x2.csv\n',
    );
    const r = batch([m, '--out', join(dir, 'bad-out')]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(
      /line 2, column 3 \(weather\).*\(1 more rows have problems: lines 4\); nothing was run/,
    );
  });

  it('refuses shard settings that do not name one shard', () => {
    const m = join(dir, 'jobs.csv');
    const out = join(dir, 'bad-out');
    const cases: Array<[string[], Record<string, string>, RegExp]> = [
      [['--shard', '4/4'], {}, /--shard 4\/4: K must be below N/],
      [['--shard', '1-4'], {}, /--shard expects K\/N/],
      [['--shards', '4'], { JOB_COMPLETION_INDEX: '' }, /--shards 4 needs the shard's index/],
      [[], { JOB_COMPLETION_INDEX: '2' }, /JOB_COMPLETION_INDEX=2 is set but --shards is not/],
      [
        ['--shards', '4'],
        { SLURM_ARRAY_TASK_ID: '4' },
        /SLURM_ARRAY_TASK_ID=4 is not below --shards 4.*--array=0-3/,
      ],
      [['--shard', '1/4', '--shards', '3'], {}, /disagree/],
    ];
    for (const [args, env, message] of cases) {
      const r = batch([m, '--out', out, ...args], env);
      expect(r.code, r.stderr).toBe(1);
      expect(r.stderr).toMatch(message);
    }
    expect(existsSync(out)).toBe(false);
  });
});
