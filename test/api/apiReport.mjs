// The API report: every export of the package entries (package.json `exports`: `tileflux` =
// src/index.ts, `tileflux/core` = src/core.ts) with its kind and its declaration as tsc emits it
// in a .d.ts, sorted by name. `npm run api` writes it to test/api/api-report.md; the test beside
// this file regenerates it in memory and fails when the committed file differs, so a change of
// the public API shows in review as a change of that file.
//
// The declarations are emitted in memory from src/ (nothing is read from dist/), printed without
// their doc comments.
import { readFileSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import ts from 'typescript';

const root = join(import.meta.dirname, '..', '..');
export const REPORT_PATH = join(root, 'test', 'api', 'api-report.md');

/**
 * The package's entries: `exports` of package.json, each built file mapped back to its source
 * (`./dist/core.js` -> `src/core.ts`), in the order package.json gives them.
 *
 * @returns {Array<{ name: string, source: string }>}
 */
export function packageEntries() {
  const pkg = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8'));
  return Object.entries(pkg.exports).map(([subpath, target]) => {
    const m = /^\.\/dist\/(.+)\.js$/.exec(target);
    if (!m)
      throw new Error(`package.json exports["${subpath}"] = ${target}: not a ./dist/*.js file`);
    return {
      name: subpath === '.' ? pkg.name : `${pkg.name}/${subpath.slice(2)}`,
      source: `src/${m[1]}.ts`,
    };
  });
}

/** Kind of a top-level declaration, in TypeScript's own words. */
function kindOf(/** @type {ts.Statement} */ st) {
  if (ts.isFunctionDeclaration(st)) return 'function';
  if (ts.isClassDeclaration(st)) return 'class';
  if (ts.isInterfaceDeclaration(st)) return 'interface';
  if (ts.isTypeAliasDeclaration(st)) return 'type';
  if (ts.isEnumDeclaration(st)) return 'enum';
  if (ts.isModuleDeclaration(st)) return 'namespace';
  if (ts.isVariableStatement(st)) {
    const flags = st.declarationList.flags;
    return flags & ts.NodeFlags.Const ? 'const' : flags & ts.NodeFlags.Let ? 'let' : 'var';
  }
  return ts.SyntaxKind[st.kind];
}

/** Whether a top-level .d.ts statement declares `name`. */
function declares(/** @type {ts.Statement} */ st, /** @type {string} */ name) {
  if (ts.isVariableStatement(st)) {
    return st.declarationList.declarations.some(
      (d) => ts.isIdentifier(d.name) && d.name.text === name,
    );
  }
  return 'name' in st && st.name !== undefined && ts.isIdentifier(st.name) && st.name.text === name;
}

/**
 * Every export of every package entry: name, kinds and declaration text (as in the emitted
 * .d.ts, without comments), sorted by name; and the export names of the `barrels` asked for
 * (source files such as `src/drainage/index.ts`).
 *
 * @param {{ barrels?: string[] }} [options]
 * @returns {{
 *   entries: Array<{ entry: string, source: string, exports: ApiExport[] }>,
 *   barrels: Array<{ source: string, names: string[] }>,
 * }}
 */
export function collectApi({ barrels = [] } = {}) {
  const entries = packageEntries();
  const config = ts.getParsedCommandLineOfConfigFile(
    join(root, 'tsconfig.json'),
    {},
    {
      ...ts.sys,
      onUnRecoverableConfigFileDiagnostic: (d) => {
        throw new Error(ts.flattenDiagnosticMessageText(d.messageText, '\n'));
      },
    },
  );
  const { outDir, rootDir } = config.options;
  const program = ts.createProgram(
    [...entries.map((e) => e.source), ...barrels].map((f) => join(root, f)),
    { ...config.options, declaration: true, emitDeclarationOnly: true, noEmit: false },
  );
  /** @type {Map<string, ts.SourceFile>} emitted .d.ts by the source file it came from */
  const dts = new Map();
  const emitted = program.emit(undefined, (fileName, text) => {
    const source = join(rootDir, relative(outDir, fileName)).replace(/\.d\.ts$/, '.ts');
    dts.set(source, ts.createSourceFile(fileName, text, ts.ScriptTarget.Latest, true));
  });
  const problems = [...ts.getPreEmitDiagnostics(program), ...emitted.diagnostics];
  if (problems.length > 0) {
    const host = {
      getCanonicalFileName: (f) => f,
      getCurrentDirectory: () => root,
      getNewLine: () => '\n',
    };
    throw new Error(
      `the API report needs src/ to compile:\n${ts.formatDiagnostics(problems, host)}`,
    );
  }
  const checker = program.getTypeChecker();
  const printer = ts.createPrinter({ removeComments: true, newLine: ts.NewLineKind.LineFeed });
  const exportsOf = (/** @type {string} */ source) =>
    checker.getExportsOfModule(
      checker.getSymbolAtLocation(program.getSourceFile(join(root, source))),
    );

  /** @returns {ApiExport} */
  const describe = (/** @type {string} */ entry, /** @type {ts.Symbol} */ s) => {
    const target = s.flags & ts.SymbolFlags.Alias ? checker.getAliasedSymbol(s) : s;
    const declaringFiles = new Set(
      (target.declarations ?? []).map((d) => d.getSourceFile().fileName),
    );
    const statements = [];
    for (const f of declaringFiles) {
      const d = dts.get(f);
      if (!d) throw new Error(`${entry} exports ${s.name}, declared outside src/ (${f})`);
      statements.push(
        ...d.statements.filter((st) => declares(st, target.name)).map((st) => [st, d]),
      );
    }
    if (statements.length === 0) {
      throw new Error(`${entry} exports ${s.name}: no declaration of it in the emitted .d.ts`);
    }
    return {
      name: s.name,
      kind: [...new Set(statements.map(([st]) => kindOf(st)))].join(' + '),
      text: statements
        .map(([st, d]) => printer.printNode(ts.EmitHint.Unspecified, st, d))
        .join('\n'),
      origin: `${relative(root, [...declaringFiles][0])}#${target.name}`,
    };
  };

  return {
    entries: entries.map(({ name, source }) => ({
      entry: name,
      source,
      exports: exportsOf(source)
        .map((s) => describe(name, s))
        .sort((a, b) => byName(a.name, b.name)),
    })),
    barrels: barrels.map((source) => ({ source, names: exportsOf(source).map((s) => s.name) })),
  };
}

/**
 * @typedef {{ name: string, kind: string, text: string, origin: string }} ApiExport
 * `origin` is the declaring file and name (`src/errors.ts#check`): the same export reached
 * through two entries has the same origin.
 */

/** Alphabetical whatever the case, then upper case first: the order is the same everywhere. */
function byName(/** @type {string} */ a, /** @type {string} */ b) {
  const [x, y] = [a.toLowerCase(), b.toLowerCase()];
  if (x !== y) return x < y ? -1 : 1;
  return a < b ? -1 : a > b ? 1 : 0;
}

/** One export as a block: a comment line with its name and kind, then its declaration. */
const block = (/** @type {{ name: string, kind: string, text: string }} */ e) =>
  `// ${e.name}: ${e.kind}\n${e.text}\n`;

/** Source of the Node entry, which re-exports all of the core's entry (src/core.ts). */
const NODE_SOURCE = 'src/index.ts';
const CORE_SOURCE = 'src/core.ts';

/** @param {ReturnType<typeof collectApi>['entries']} api */
const nodeAndCore = (api) => {
  const node = api.find((a) => a.source === NODE_SOURCE);
  const core = api.find((a) => a.source === CORE_SOURCE);
  if (!node || !core)
    throw new Error(`package.json exports must name ${NODE_SOURCE} and ${CORE_SOURCE}`);
  return { node, core };
};

/**
 * The report's text: the core entry first, then the others. The Node entry (`tileflux`)
 * re-exports all of the core (`tileflux/core`): its section lists only what it adds.
 *
 * @param {ReturnType<typeof collectApi>['entries']} api
 * @returns {string}
 */
export function formatReport(api) {
  const { node, core } = nodeAndCore(api);
  const lines = [
    '# Public API',
    '',
    'Every export of the package entries with its kind and its declaration as in the emitted',
    '`.d.ts` (doc comments left out), sorted by name. Generated by `npm run api`',
    '(`test/api/apiReport.mjs`); `test/api/apiReport.test.ts` fails when this file differs from',
    'what the sources export. Do not edit it by hand.',
    '',
  ];
  for (const a of [core, ...api.filter((x) => x !== core)]) {
    const shared = new Set(a === node ? core.exports.map((e) => e.name) : []);
    const own = a.exports.filter((e) => !shared.has(e.name));
    lines.push(`## ${a.entry} (${a.source})`, '');
    lines.push(
      a === node
        ? `Everything of \`${core.entry}\` above, and ${own.length} more (${a.exports.length} exports in all):`
        : `${a.exports.length} exports:`,
      '',
    );
    lines.push('```ts', own.map(block).join('\n').trimEnd(), '```', '');
  }
  return lines.join('\n');
}

/**
 * Names of the core's exports that the Node entry does not re-export, or exports as another
 * declaration under the same name.
 *
 * @param {ReturnType<typeof collectApi>['entries']} api
 * @returns {string[]}
 */
export function missingFromNode(api) {
  const { node, core } = nodeAndCore(api);
  const origins = new Map(node.exports.map((e) => [e.name, e.origin]));
  return core.exports.filter((e) => origins.get(e.name) !== e.origin).map((e) => e.name);
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const api = collectApi().entries;
  const missing = missingFromNode(api);
  if (missing.length > 0) {
    console.error(`add to src/index.ts what it leaves out of src/core.ts: ${missing.join(', ')}`);
    process.exit(1);
  }
  writeFileSync(REPORT_PATH, formatReport(api));
  console.log(`wrote ${relative(root, REPORT_PATH)}`);
}
