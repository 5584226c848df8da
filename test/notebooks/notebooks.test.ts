// The notebooks in notebooks/: committed without outputs, type-correct against the built library,
// and executed headlessly as a user would run them (Debian's nbconvert/nbclient driving the Deno
// kernel from the project's `deno` package), with every expected Vega-Lite chart displayed.
import { execFile } from 'node:child_process';
import {
  existsSync,
  mkdirSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  rmSync,
  symlinkSync,
  writeFileSync,
} from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderSvg } from '../../src/report/renderChart.js';

const root = join(import.meta.dirname, '..', '..');
const notebooksDir = join(root, 'notebooks');
const deno = join(root, 'node_modules', '.bin', 'deno');
const run = promisify(execFile);

/** Every notebook and the number of Vega-Lite charts it displays when run on the demo data. */
const NOTEBOOKS = [
  { file: '1-adviser-shallow-drains.ipynb', charts: 4 },
  { file: '2-planner-alternatives.ipynb', charts: 4 },
  { file: '3-owner-board-schedule.ipynb', charts: 4 },
];
/** The Vega-Lite MIME type JupyterLab 4 renders (see notebooks/helpers.ts). */
const VEGA_LITE_MIME = 'application/vnd.vegalite.v5+json';

interface Output {
  output_type: string;
  data?: Record<string, unknown>;
  text?: string | string[];
  ename?: string;
  evalue?: string;
}
interface Cell {
  cell_type: 'code' | 'markdown' | 'raw';
  source: string | string[];
  outputs?: Output[];
  execution_count?: number | null;
  metadata?: Record<string, unknown>;
}
interface Notebook {
  cells: Cell[];
  metadata: { kernelspec?: { name?: string }; language_info?: { name?: string } };
}

const text = (s: string | string[] | undefined) => (Array.isArray(s) ? s.join('') : (s ?? ''));
const readNotebook = (path: string) => JSON.parse(readFileSync(path, 'utf8')) as Notebook;

let tmp: string;
beforeAll(() => {
  // The notebooks import the built library, which the global setup builds once per test run.
  tmp = mkdtempSync(join(tmpdir(), 'tileflux-notebooks-'));
});
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

describe('notebooks as committed', () => {
  it('are exactly the notebooks listed here (a new notebook needs its chart count)', () => {
    const found = readdirSync(notebooksDir)
      .filter((f) => f.endsWith('.ipynb'))
      .sort();
    expect(found).toEqual(NOTEBOOKS.map((n) => n.file));
  });

  it.each(NOTEBOOKS)('$file carries no outputs and no execution counts', ({ file }) => {
    const nb = readNotebook(join(notebooksDir, file));
    const dirty = nb.cells
      .map((c, i) => ({ i: i + 1, c }))
      .filter(
        ({ c }) =>
          c.cell_type === 'code' &&
          ((c.outputs ?? []).length > 0 ||
            (c.execution_count ?? null) !== null ||
            c.metadata?.execution !== undefined),
      )
      .map(({ i }) => i);
    // Fix with: node notebooks/strip-outputs.mjs
    expect(dirty, `cells with outputs in ${file}`).toEqual([]);
  });

  it.each(NOTEBOOKS)(
    '$file runs on the Deno kernel, opens with its question and settings, ends with the cautions',
    ({ file }) => {
      const nb = readNotebook(join(notebooksDir, file));
      expect(nb.metadata.kernelspec?.name).toBe('deno');
      expect(nb.metadata.language_info?.name).toBe('typescript');
      const [intro] = nb.cells;
      expect(intro.cell_type).toBe('markdown');
      expect(text(intro.source)).toMatch(/^# .+\n[\s\S]*answers/);
      const firstCode = nb.cells.find((c) => c.cell_type === 'code')!;
      expect(text(firstCode.source)).toMatch(/const WEATHER_FILE = '[^']+';/);
      expect(text(firstCode.source)).toMatch(/const FIELD_FILE = '[^']+';/);
      const last = nb.cells[nb.cells.length - 1];
      expect(last.cell_type).toBe('markdown');
      const cautions = text(last.source);
      expect(cautions).toMatch(/^## Cautions/);
      expect(cautions).toMatch(/planning estimates from simplified physics/);
      expect(cautions).toMatch(/conservation practice\s+standards/);
      expect(cautions).toMatch(/licensed professional/);
      expect(cautions).toMatch(/dangerous/);
    },
  );
});

/**
 * The code cells of a notebook as one module (the kernel keeps one scope across cells), with
 * its relative imports made absolute, and a map from module line to cell number.
 */
function moduleOf(nb: Notebook): { source: string; cellOfLine: number[] } {
  const lines: string[] = [];
  const cellOfLine: number[] = [];
  nb.cells.forEach((c, i) => {
    if (c.cell_type !== 'code') return;
    for (const line of `// cell ${i + 1}\n${text(c.source)}\n`.split('\n')) {
      lines.push(
        line
          .replace(/from '\.\.\/dist\//g, `from '${root}/dist/`)
          .replace(/from '\.\/helpers\.ts'/g, `from '${notebooksDir}/helpers.ts'`),
      );
      cellOfLine.push(i + 1);
    }
  });
  return { source: lines.join('\n'), cellOfLine };
}

describe('notebook code', () => {
  it('type-checks against the built library and the Deno kernel API', async () => {
    // TypeScript itself, with the declarations the Deno release prints (`deno types`, which
    // include Deno.jupyter); the kernel runs cells without checking them.
    const dir = join(tmp, 'typecheck');
    mkdirSync(dir);
    symlinkSync(join(root, 'node_modules'), join(dir, 'node_modules'), 'dir');
    writeFileSync(join(dir, 'package.json'), '{ "type": "module" }\n');
    const { stdout: denoTypes } = await run(deno, ['types'], { maxBuffer: 64 * 1024 * 1024 });
    writeFileSync(join(dir, 'deno.d.ts'), denoTypes);
    const maps: Record<string, number[]> = {};
    for (const { file } of NOTEBOOKS) {
      const name = file.replace(/\.ipynb$/, '.ts');
      const m = moduleOf(readNotebook(join(notebooksDir, file)));
      writeFileSync(join(dir, name), m.source);
      maps[name] = m.cellOfLine;
    }
    writeFileSync(
      join(dir, 'tsconfig.json'),
      JSON.stringify({
        compilerOptions: {
          target: 'ES2022',
          lib: ['ES2022'],
          module: 'NodeNext',
          moduleResolution: 'NodeNext',
          strict: true,
          noEmit: true,
          skipLibCheck: true,
          allowImportingTsExtensions: true,
          types: [],
        },
        files: ['deno.d.ts', ...Object.keys(maps)],
      }),
    );
    const tsc = join(root, 'node_modules', 'typescript', 'bin', 'tsc');
    const result = await run(process.execPath, [tsc, '-p', dir], { cwd: dir }).then(
      () => '',
      (err: { stdout?: string }) => err.stdout ?? String(err),
    );
    // Point each error at its notebook cell.
    const located = result.replace(/([\w-]+\.ts)\((\d+),(\d+)\):/g, (all, name, line) =>
      maps[name] ? `${name.replace(/\.ts$/, '.ipynb')} cell ${maps[name][line - 1]}:` : all,
    );
    expect(located).toBe('');
  }, 120_000);
});

describe('notebooks executed headlessly', () => {
  const executed = new Map<string, Notebook>();
  const failures = new Map<string, string>();
  let seconds = 0;

  beforeAll(async () => {
    // Register the Deno kernel in a private Jupyter data folder (deno writes it under
    // $XDG_DATA_HOME/jupyter/kernels), so that no user setting is touched and none is needed.
    const data = join(tmp, 'data');
    const env = { ...process.env, HOME: tmp, XDG_DATA_HOME: data };
    await run(deno, ['jupyter', '--install', '--force'], { env });
    const kernelSpec = join(data, 'jupyter', 'kernels', 'deno', 'kernel.json');
    expect(existsSync(kernelSpec), `${kernelSpec} written by deno jupyter --install`).toBe(true);

    const out = join(tmp, 'executed');
    const jupyterEnv = {
      ...process.env,
      JUPYTER_PATH: join(data, 'jupyter'),
      JUPYTER_RUNTIME_DIR: join(tmp, 'runtime'),
      NO_COLOR: '1',
    };
    const start = performance.now();
    // Debian's nbconvert (the PATH may lead to another Python first), one process per notebook.
    await Promise.all(
      NOTEBOOKS.map(({ file }) =>
        run(
          '/usr/bin/python3',
          [
            '-m',
            'nbconvert',
            '--to',
            'notebook',
            '--execute',
            '--ExecutePreprocessor.kernel_name=deno',
            '--ExecutePreprocessor.timeout=120',
            '--output-dir',
            out,
            join(notebooksDir, file),
          ],
          { env: jupyterEnv, cwd: root, maxBuffer: 16 * 1024 * 1024 },
        ).then(
          () => executed.set(file, readNotebook(join(out, file))),
          (err: { stderr?: string }) => {
            // Keep nbconvert's account of the failing cell (its source and the error), not the
            // Python traceback before it.
            const stderr = err.stderr ?? String(err);
            const at = stderr.indexOf('An error occurred while executing the following cell');
            failures.set(file, at >= 0 ? stderr.slice(at) : stderr.slice(-4000));
          },
        ),
      ),
    );
    seconds = (performance.now() - start) / 1000;
  }, 300_000);

  it('all run within two minutes', () => {
    expect(seconds).toBeLessThan(120);
  });

  describe.each(NOTEBOOKS)('$file', ({ file, charts }) => {
    const nb = () => {
      // A failing cell stops nbconvert; its message names the cell and the error.
      expect(failures.get(file) ?? '', `${file} failed to run`).toBe('');
      return executed.get(file)!;
    };
    const outputs = () => nb().cells.flatMap((c) => c.outputs ?? []);

    it('runs every cell without an error', () => {
      const errors = outputs().filter((o) => o.output_type === 'error');
      expect(errors.map((o) => `${o.ename}: ${o.evalue}`)).toEqual([]);
      const unrun = nb().cells.filter((c) => c.cell_type === 'code' && c.execution_count == null);
      expect(unrun.length).toBe(0);
    });

    it(`displays its ${charts} Vega-Lite charts, each with data, each drawable`, async () => {
      const specs = outputs()
        .map((o) => o.data?.[VEGA_LITE_MIME])
        .filter((s): s is Record<string, unknown> => s !== undefined);
      expect(specs.length).toBe(charts);
      for (const spec of specs) {
        expect(spec.$schema).toBe('https://vega.github.io/schema/vega-lite/v5.json');
        // Every inline dataset has rows, and no value came out NaN or undefined (JSON null).
        const datasets: unknown[][] = [];
        JSON.stringify(spec, (key, value) => {
          if (key === 'values' && Array.isArray(value)) datasets.push(value);
          return value;
        });
        expect(datasets.length).toBeGreaterThan(0);
        for (const values of datasets) {
          expect(values.length).toBeGreaterThan(0);
          for (const row of values) {
            expect(Object.values(row as object).every((v) => v !== null)).toBe(true);
          }
        }
        // Vega-Lite compiles it and Vega draws marks (what the front end's renderer does).
        expect(await renderSvg(spec)).toMatch(/class="mark-[a-z]+ role-mark/);
      }
    });

    it('shows no NaN, undefined or n/a in its text', () => {
      const shown = outputs()
        .flatMap((o) => [
          text(o.text),
          text(o.data?.['text/plain'] as string[] | undefined),
          text(o.data?.['text/markdown'] as string[] | undefined),
        ])
        .join('\n');
      expect(shown).not.toMatch(/\bNaN\b|\bundefined\b|\bn\/a\b/);
    });
  });
});
