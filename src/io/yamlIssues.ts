/**
 * Located errors for YAML input files (field files, system files): parse a mapping with line and
 * column positions, find the line and column of any key path, and turn a zod validation issue
 * into one message that names the place, the key, what is wrong and what is accepted, with a
 * "did you mean" for a misspelt key (Levenshtein distance).
 */
import { LineCounter, parseDocument, isMap, isScalar, type Document } from 'yaml';
import type { z } from 'zod';
import { clip, TilefluxError } from '../errors.js';

/** A path into a YAML document: keys and list indices. */
export type Path = Array<string | number>;

/** Levenshtein distance, for "did you mean". */
function distance(a: string, b: string): number {
  const m = a.length;
  const n = b.length;
  const row = Array.from({ length: n + 1 }, (_, j) => j);
  for (let i = 1; i <= m; i++) {
    let prev = row[0];
    row[0] = i;
    for (let j = 1; j <= n; j++) {
      const tmp = row[j];
      row[j] = Math.min(row[j] + 1, row[j - 1] + 1, prev + (a[i - 1] === b[j - 1] ? 0 : 1));
      prev = tmp;
    }
  }
  return row[n];
}

/** The closest accepted name, if it is close enough to be a likely typo. */
export function suggest(word: string, accepted: readonly string[]): string | undefined {
  let best: string | undefined;
  let bestD = Infinity;
  for (const a of accepted) {
    const d = distance(word.toLowerCase(), a.toLowerCase());
    if (d < bestD) {
      bestD = d;
      best = a;
    }
  }
  return best !== undefined && bestD <= Math.max(2, Math.floor(best.length / 3)) ? best : undefined;
}

/** Keys accepted by the (object) schema found at `path`, for suggestions. */
export function acceptedKeys(schema: z.ZodType, path: Path): string[] {
  let s: unknown = schema;
  const unwrap = (x: unknown): unknown => {
    for (let k = 0; k < 10; k++) {
      const def = (x as { _zod?: { def?: Record<string, unknown> } })?._zod?.def;
      if (!def) return x;
      if (def.innerType) x = def.innerType;
      else if (def.type === 'pipe') x = def.in;
      else return x;
    }
    return x;
  };
  const keysOf = (x: unknown): string[] => {
    const def = (unwrap(x) as { _zod?: { def?: Record<string, unknown> } })?._zod?.def;
    if (!def) return [];
    if (def.type === 'object') return Object.keys(def.shape as object);
    if (def.type === 'union') return (def.options as unknown[]).flatMap(keysOf);
    return [];
  };
  for (const key of path) {
    const def = (unwrap(s) as { _zod?: { def?: Record<string, unknown> } })?._zod?.def;
    if (!def) return [];
    if (def.type === 'object') s = (def.shape as Record<string, unknown>)[String(key)];
    else if (def.type === 'array') s = def.element;
    else if (def.type === 'union') {
      const opts = def.options as unknown[];
      s =
        opts.find((o) => keysOf(o).includes(String(key))) ??
        opts.find(
          (o) => (unwrap(o) as { _zod: { def: { type: string } } })._zod.def.type === 'array',
        );
      if (
        s &&
        (unwrap(s) as { _zod: { def: { type: string; element?: unknown } } })._zod.def.type ===
          'array' &&
        typeof key === 'number'
      ) {
        s = (unwrap(s) as { _zod: { def: { element: unknown } } })._zod.def.element;
      }
    } else return [];
  }
  return keysOf(s);
}

/** Source range start of a YAML node, if it has one. */
function startOf(node: unknown): number | undefined {
  return (node as { range?: [number, number, number] } | undefined)?.range?.[0];
}

/**
 * "line L, column C" of the key or value at `path` (or of its nearest existing parent): a
 * scalar points at its value, a mapping or list at the key that holds it, and `key` (an unknown
 * key inside the mapping at `path`) at that key.
 */
export function locate(doc: Document, lc: LineCounter, path: Path, key?: string): string {
  const at = (offset: number) => {
    const pos = lc.linePos(offset);
    return `line ${pos.line}, column ${pos.col}`;
  };
  for (let k = path.length; k >= 0; k--) {
    const node = doc.getIn(path.slice(0, k), true);
    if (node === undefined) continue;
    if (key !== undefined && k === path.length && isMap(node)) {
      const pair = node.items.find((p) => isScalar(p.key) && String(p.key.value) === key);
      const offset = startOf(pair?.key);
      if (offset !== undefined) return at(offset);
    }
    if (isScalar(node) && k === path.length && startOf(node) !== undefined)
      return at(startOf(node)!);
    if (k > 0) {
      const parent = doc.getIn(path.slice(0, k - 1), true);
      if (isMap(parent)) {
        const name = String(path[k - 1]);
        const pair = parent.items.find((p) => isScalar(p.key) && String(p.key.value) === name);
        const offset = startOf(pair?.key);
        if (offset !== undefined) return at(offset);
      }
    }
    const offset = startOf(node);
    if (offset !== undefined) return at(offset);
  }
  return 'line 1, column 1';
}

/** A key path as people write it: `drains.spacing`, `scenarios[1].outlet`. */
function keyPath(path: Path): string {
  return path.reduce<string>(
    (acc, k) => (typeof k === 'number' ? `${acc}[${k}]` : acc ? `${acc}.${k}` : k),
    '',
  );
}

/**
 * One validation issue in words: the path it is at, the key it names (for a misspelt or missing
 * key) and the message, with what is accepted there.
 */
export function describeIssue(
  issue: z.core.$ZodIssue,
  schema: z.ZodType,
  input: unknown,
): { path: Path; key?: string; message: string } {
  const path = issue.path.map((p) => (typeof p === 'symbol' ? String(p) : p)) as Path;
  if (issue.code === 'unrecognized_keys') {
    const key = issue.keys[0];
    const hint = suggest(key, acceptedKeys(schema, path));
    const accepted = acceptedKeys(schema, path);
    return {
      path,
      key,
      message:
        `unknown key "${keyPath([...path, key])}"` +
        (hint
          ? `; did you mean "${hint}"?`
          : accepted.length
            ? `; accepted keys here: ${accepted.join(', ')}`
            : ''),
    };
  }
  let value: unknown = input;
  for (const k of path) value = (value as Record<string | number, unknown> | undefined)?.[k];
  const where = keyPath(path) || 'the file';
  if (value === undefined) return { path, message: `${where} is required` };
  if (typeof value === 'number' && !Number.isFinite(value)) {
    // YAML's .nan and .inf: JSON would show them as null.
    const what = Number.isNaN(value) ? 'is not a number (.nan)' : 'is infinite (.inf)';
    const accepted = acceptedOf(schema, path);
    return { path, message: `${where} ${what}${accepted ? `; accepted: ${accepted}` : ''}` };
  }
  if (issue.code === 'invalid_union') {
    // The branch the value was meant for (its shape matched) reports its own, deeper issue.
    const branch = issue.errors.find(
      (errs) =>
        errs.length > 0 &&
        !errs.some(
          (e) =>
            e.path.length === 0 &&
            (e.code === 'invalid_type' ||
              e.code === 'unrecognized_keys' ||
              e.code === 'invalid_value' ||
              e.code === 'invalid_union'),
        ),
    );
    if (branch) {
      const inner = describeIssue(
        { ...firstIssue(branch), path: [...issue.path, ...firstIssue(branch).path] },
        schema,
        input,
      );
      if (inner.path.length > path.length) return inner;
      const accepted = acceptedOf(schema, path);
      return {
        path,
        message:
          accepted && !inner.message.includes('; accepted: ')
            ? `${inner.message}; accepted: ${accepted}`
            : inner.message,
      };
    }
    const accepted = acceptedOf(schema, path);
    return {
      path,
      message:
        `${where} has an unexpected value ${show(value)}` +
        (accepted ? `; accepted: ${accepted}` : ''),
    };
  }
  if (issue.code === 'invalid_value') {
    return {
      path,
      message: `${where} must be one of ${issue.values.map((v) => JSON.stringify(v)).join(', ')}; got ${show(value)}`,
    };
  }
  if (issue.code === 'invalid_type') {
    return { path, message: `${where} expects ${issue.expected}; got ${show(value)}` };
  }
  return { path, message: `${where} ${issue.message}` };
}

/** A value as echoed in a message: JSON, cut to about 80 characters. */
function show(value: unknown): string {
  return clip(JSON.stringify(value) ?? String(value));
}

/** The description of the schema at `path` (what it accepts), if it has one. */
function acceptedOf(schema: z.ZodType, path: Path): string | undefined {
  type Def = { type: string; [k: string]: unknown };
  const defOf = (x: unknown) => (x as { _zod?: { def?: Def } } | undefined)?._zod?.def;
  const descOf = (x: unknown) => (x as { description?: string } | undefined)?.description;
  // Walk down, remembering the outermost description of the node at the end of the path.
  const unwrap = (x: unknown): unknown => {
    for (let k = 0; k < 10; k++) {
      const def = defOf(x);
      if (def?.innerType) x = def.innerType;
      else if (def?.type === 'pipe') x = def.in;
      else return x;
    }
    return x;
  };
  const child = (x: unknown, key: string | number): unknown => {
    const def = defOf(unwrap(x));
    if (!def) return undefined;
    if (def.type === 'object') return (def.shape as Record<string, unknown>)[String(key)];
    if (def.type === 'array') return def.element;
    if (def.type === 'record') return def.valueType;
    if (def.type === 'union') {
      for (const o of def.options as unknown[]) {
        const c = child(o, key);
        if (c !== undefined) return c;
      }
    }
    return undefined;
  };
  let s: unknown = schema;
  for (const key of path) {
    s = child(s, key);
    if (s === undefined) return undefined;
  }
  for (let k = 0; k < 10 && s; k++) {
    const d = descOf(s);
    if (d) return d.replace(/\.$/, '');
    const def = defOf(s);
    s = def?.innerType ?? (def?.type === 'pipe' ? def.in : undefined);
  }
  return undefined;
}

/** The issue to report first: a misspelt key explains the missing key it usually causes. */
export function firstIssue(issues: z.core.$ZodIssue[]): z.core.$ZodIssue {
  return issues.find((i) => i.code === 'unrecognized_keys') ?? issues[0];
}

/** A YAML mapping read for validation: its plain value and what locates its keys. */
export interface YamlSource {
  doc: Document;
  lc: LineCounter;
  raw: Record<string, unknown>;
}

/**
 * Parse YAML text whose top level must be a mapping; a syntax error is located by line and
 * column. `topKeys` names a few expected keys for the message when the top level is not a mapping.
 */
export function readYamlMapping(text: string, file: string, topKeys: string): YamlSource {
  const lc = new LineCounter();
  const doc = parseDocument(text.replace(/^\uFEFF/, ''), { lineCounter: lc, prettyErrors: false });
  if (doc.errors.length > 0) {
    const e = doc.errors[0];
    const pos = lc.linePos(e.pos[0]);
    throw new TilefluxError(
      `line ${pos.line}, column ${pos.col}: YAML syntax error: ${e.message.split('\n')[0]}`,
      file,
    );
  }
  let raw: unknown;
  try {
    raw = doc.toJS();
  } catch (err) {
    // The yaml library refuses documents whose aliases expand past a limit (an "alias bomb").
    if (err instanceof ReferenceError && /alias/i.test(err.message)) {
      throw new TilefluxError(
        'YAML aliases (*name) expand to too many values (the resource guard against alias bombs); write the values out or use fewer aliases',
        file,
      );
    }
    throw err;
  }
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) {
    throw new TilefluxError(`expects a mapping of keys (${topKeys}) at the top level`, file);
  }
  return { doc, lc, raw: raw as Record<string, unknown> };
}

/**
 * The located one-line error of a validation issue: "line L, column C: key message", with
 * "did you mean" for a misspelt key. `prefix` is the path of the validated part in the file;
 * `note` goes between the location and the message.
 */
export function locatedIssue(
  src: YamlSource,
  schema: z.ZodType,
  issues: z.core.$ZodIssue[],
  input: unknown,
  prefix: Path = [],
  note = '',
): string {
  const d = describeIssue(firstIssue(issues), schema, input);
  return `${locate(src.doc, src.lc, [...prefix, ...d.path], d.key)}: ${note}${d.message}`;
}
