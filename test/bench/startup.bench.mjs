// Start-up of the command line: wall and CPU time of `tileflux --help`, of every command's
// `--help` (the catalog's commands and `weather check`: each loads its options and help text,
// not its work) and of a bare `node -e 0` beside them (what any command costs at least), seven
// runs each, fastest / median / slowest, then the slowest command's median. CPU time (user + system) comes from /usr/bin/time when the machine
// has it; the machine is shared, so it is the steadier figure.
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { spread } from './prepared.bench.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const main = join(root, 'dist/cli/main.js');
const RUNS = 7;
const TIME = '/usr/bin/time';

/** Wall and CPU seconds of one run of node with `args`. */
function once(args, dir) {
  const t = performance.now();
  if (!existsSync(TIME)) {
    execFileSync(process.execPath, args, { stdio: 'ignore' });
    return { wall: (performance.now() - t) / 1000, cpu: NaN };
  }
  const out = join(dir, 'time.txt');
  const r = spawnSync(TIME, ['-f', '%U %S', '-o', out, process.execPath, ...args], {
    stdio: 'ignore',
  });
  const wall = (performance.now() - t) / 1000;
  if (r.status !== 0) throw new Error(`node ${args.join(' ')} exited with ${r.status}`);
  const [user, sys] = readFileSync(out, 'utf8').trim().split(/\s+/).map(Number);
  return { wall, cpu: user + sys };
}

export default async function () {
  const dir = mkdtempSync(join(tmpdir(), 'tileflux-startup-'));
  const { COMMANDS } = await import(pathToFileURL(join(root, 'dist/cli/catalog.js')).href);
  const commands = [...COMMANDS.map((c) => [c.name]), ['weather', 'check']];
  const cases = [
    ['bare node (node -e 0)', ['-e', '0']],
    ['tileflux --help', [main, '--help']],
    ...commands.map((words) => [`tileflux ${words.join(' ')} --help`, [main, ...words, '--help']]),
  ];
  const figures = [];
  const medians = [];
  for (const [name, args] of cases) {
    once(args, dir); // warm the file cache
    const runs = Array.from({ length: RUNS }, () => once(args, dir));
    for (const [what, key] of [
      ['wall', 'wall'],
      ['CPU', 'cpu'],
    ]) {
      const xs = runs.map((r) => r[key]);
      if (xs.some(Number.isNaN)) continue;
      const s = spread(xs);
      if (what === 'wall' && args[0] === main && args.length > 2) medians.push([name, s.median]);
      figures.push(
        { name: `${name}, ${what}, fastest`, value: s.min, unit: 's' },
        { name: `${name}, ${what}, median`, value: s.median, unit: 's' },
        { name: `${name}, ${what}, slowest`, value: s.max, unit: 's' },
      );
    }
  }
  rmSync(dir, { recursive: true, force: true });
  const [slowest, median] = medians.reduce((a, b) => (b[1] > a[1] ? b : a));
  figures.push({
    name: `slowest command help, median wall (${slowest})`,
    value: median,
    unit: 's',
  });
  return figures;
}
