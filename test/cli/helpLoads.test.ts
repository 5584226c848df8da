// A command's --help loads the command's options and help text only: its work (the engine, the
// scenarios and their zod schemas, the reports and charts, the unit parser, the readers) is
// imported when its action runs. Each command's --help runs in a child process that records
// every module it loads (test/support/recordLoads.mjs), and none of the heavy ones may be among
// them. Speed itself is measured by the startup benchmark, not here.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { COMMANDS } from '../../src/cli/catalog.js';
import { cli } from './harness.js';

const RECORD = pathToFileURL(join(import.meta.dirname, '..', 'support', 'recordLoads.mjs')).href;
const dir = mkdtempSync(join(tmpdir(), 'tileflux-loads-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Modules a --help must not load: the work of the commands, and the libraries it needs. */
const HEAVY = [
  /\/dist\/(engine|nitrate|scenarios|report|explorer)\//,
  /\/dist\/cli\/(actions\/|runShared|progress|fitPool)/,
  /\/node_modules\/(zod|vega[^/]*|js-quantities|yaml|csv-parse|csv-stringify|piscina|cli-progress|@duckdb|@resvg)\//,
];

let runs = 0;
/** The URLs of the modules `tileflux ...args` loads, and its exit status and output. */
function loadsOf(args: string[]): { urls: string[]; status: number; stdout: string } {
  const file = join(dir, `loads-${runs++}.txt`);
  const r = cli(args, { options: ['--import', RECORD], env: { TILEFLUX_LOADS_FILE: file } });
  return {
    urls: readFileSync(file, 'utf8').trim().split('\n'),
    status: r.status,
    stdout: r.stdout,
  };
}

const heavy = (urls: string[]) => urls.filter((u) => HEAVY.some((h) => h.test(u)));

describe('--help of a command', () => {
  const lines = [
    ...COMMANDS.map((c) => [c.name, '--help']),
    ['weather', 'check', '--help'],
    ['weather', 'make', '--help'],
    ['help', 'run'],
  ];
  for (const args of lines) {
    it(`tileflux ${args.join(' ')} loads no engine, schema, report or parser`, () => {
      const r = loadsOf(args);
      expect(r.status).toBe(0);
      expect(r.stdout).toMatch(/^Usage: tileflux /);
      expect(r.urls.some((u) => u.endsWith('/dist/cli/main.js'))).toBe(true);
      expect(heavy(r.urls).join('\n')).toBe('');
    });
  }

  it('records the heavy modules when a command runs (the check above can fail)', () => {
    const r = loadsOf(['init']);
    expect(r.status).toBe(0);
    expect(r.urls.some((u) => /\/node_modules\/zod\//.test(u))).toBe(true);
    expect(r.urls.some((u) => u.endsWith('/dist/cli/actions/init.js'))).toBe(true);
  });
});
