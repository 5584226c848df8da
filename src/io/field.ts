/**
 * Field files: YAML in, validated `Field` objects out, with every problem located by file, line
 * and column, and unknown keys answered with a "did you mean" suggestion.
 *
 * Scenarios are named overrides of the base field. They are merged into the base as plain data
 * (objects merge key by key, lists and values replace) and each merged field is validated with
 * the same schema, so a scenario cannot slip past a check the base must pass.
 */
import { readFileSync } from 'node:fs';
import { readTextFile } from './files.js';
import { dirname, resolve } from 'node:path';
import { LineCounter, parseDocument, isMap, isScalar, type Document } from 'yaml';
import type { z } from 'zod';
import { clip, TilefluxError } from '../errors.js';
import { fieldSchema, OVERRIDABLE, type Field } from '../scenarios/fieldSchema.js';
import { ratingFromObservations, type RatingObservationsSection } from '../nitrate/schema.js';
import type { RatingFit } from '../nitrate/types.js';
// io/system.ts uses this module's YAML helpers in turn; both only call each other at run time.
import { systemCapacityMmD } from './system.js';

/** A validated field with its scenarios merged and validated. */
export interface LoadedField {
  base: Field;
  /** Each explicit scenario as a full field (base + overrides), with its name and description. */
  scenarios: Array<{ name: string; description?: string; field: Field }>;
  /** The file's text, for hashing into the summary. */
  text: string;
  /** Rating fits made from observation files named in the field file, by file name. */
  ratingFits: Record<string, RatingFit>;
  /** Legal but probably unintended settings, one line each, for stderr. */
  warnings: string[];
}

/** Outlet steps set below the drains: legal (the outlet is then free) but rarely meant. */
function outletWarnings(f: Field, label: string): string[] {
  const o = f.outlet;
  if (o === 'free') return [];
  const [key, steps] = 'schedule' in o ? ['schedule', o.schedule] : ['dates', o.dates];
  return steps.flatMap((s, i) =>
    s.depth !== 'free' && s.depth > f.drains.depth
      ? [
          `${label}outlet.${key} step ${i + 1} (from ${s.from}) holds the outlet at ${s.depth} m, ` +
            `below the drains at ${f.drains.depth} m: the outlet is free then`,
        ]
      : [],
  );
}

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
function acceptedKeys(schema: z.ZodType, path: Path): string[] {
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

function keyPath(path: Path): string {
  return path.reduce<string>(
    (acc, k) => (typeof k === 'number' ? `${acc}[${k}]` : acc ? `${acc}.${k}` : k),
    '',
  );
}

function describeIssue(
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
function firstIssue(issues: z.core.$ZodIssue[]): z.core.$ZodIssue {
  return issues.find((i) => i.code === 'unrecognized_keys') ?? issues[0];
}

/** Merge `over` into `base`: objects key by key, anything else replaces. */
export function mergeOverrides(base: unknown, over: unknown): unknown {
  if (over === undefined) return base;
  const isObj = (x: unknown): x is Record<string, unknown> =>
    typeof x === 'object' && x !== null && !Array.isArray(x);
  if (!isObj(base) || !isObj(over)) return over;
  const out: Record<string, unknown> = { ...base };
  for (const [k, v] of Object.entries(over)) out[k] = mergeOverrides(base[k], v);
  return out;
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

/**
 * A change to one key of a field file's base given outside the file (a cell of a batch
 * manifest): the key's path, its value as YAML would read it, and where it was given, for
 * messages (e.g. "jobs.csv: line 4, column 5 (drains.spacing)").
 */
export interface FieldOverride {
  path: string[];
  value: unknown;
  where: string;
}

/**
 * Why `path` (e.g. ["drains", "spacing"]) names no key of a field file, or undefined when it
 * does; with a "did you mean" when a key is misspelt.
 */
export function fieldKeyProblem(path: readonly string[]): string | undefined {
  for (let k = 0; k < path.length; k++) {
    const accepted = acceptedKeys(fieldSchema, path.slice(0, k));
    if (!accepted.includes(path[k])) {
      const hint = suggest(path[k], accepted);
      const name = path.slice(0, k + 1).join('.');
      return (
        `"${name}" is not a field-file key` +
        (hint
          ? `; did you mean "${[...path.slice(0, k), hint].join('.')}"?`
          : accepted.length
            ? `; keys accepted here: ${accepted.join(', ')}`
            : '')
      );
    }
  }
  return undefined;
}

/** `{ a: { b: value } }` from the path ["a", "b"]. */
function nested(path: readonly string[], value: unknown): unknown {
  return path.reduceRight<unknown>((inner, key) => ({ [key]: inner }), value);
}

/**
 * Parse and validate a field file's text.
 * @param text the YAML text
 * @param file the name used in messages
 * @param overrides changes to the base given outside the file: merged into the base before it
 *   is validated (scenarios of the file then merge on top), and a value that fails the schema
 *   is reported where the override was given
 */
export function parseField(
  text: string,
  file = 'field file',
  overrides: readonly FieldOverride[] = [],
): LoadedField {
  const src = readYamlMapping(text, file, 'name, soil, drains, ...');
  const { doc, lc, raw } = src;
  const fail = (issue: z.core.$ZodIssue, input: unknown, prefix: Path, scenario = ''): never => {
    const issuePath = issue.path.map(String);
    // A value the override gave (checked with the base; a scenario's own keys are its own).
    const given =
      prefix.length === 0
        ? overrides.find((o) => o.path.every((key, k) => issuePath[k] === key))
        : undefined;
    if (given !== undefined) {
      throw new TilefluxError(describeIssue(issue, fieldSchema, input).message, given.where);
    }
    const note = scenario ? `in scenario ${scenario}: ` : '';
    throw new TilefluxError(locatedIssue(src, fieldSchema, [issue], input, prefix, note), file);
  };

  const baseRaw = overrides.reduce<Record<string, unknown>>(
    (acc, o) => mergeOverrides(acc, nested(o.path, o.value)) as Record<string, unknown>,
    raw as Record<string, unknown>,
  );
  const parsed = fieldSchema.safeParse(baseRaw);
  if (!parsed.success) fail(firstIssue(parsed.error.issues), baseRaw, []);
  const base = parsed.data as Field;

  const scenarios: LoadedField['scenarios'] = [];
  const list = Array.isArray(baseRaw.scenarios)
    ? (baseRaw.scenarios as Array<Record<string, unknown>>)
    : [];
  const names = new Set<string>();
  list.forEach((sc, i) => {
    const allowed = ['name', 'description', ...OVERRIDABLE];
    for (const key of Object.keys(sc)) {
      if (!allowed.includes(key)) {
        const hint = suggest(key, allowed);
        const at = locate(doc, lc, ['scenarios', i], key);
        throw new TilefluxError(
          `${at}: unknown key "${key}" in scenario ${scenarioLabel(sc.name, i)}` +
            (hint ? `; did you mean "${hint}"?` : `; a scenario may set ${allowed.join(', ')}`),
          file,
        );
      }
    }
    const name = String(sc.name);
    if (names.has(name)) {
      throw new TilefluxError(
        `${locate(doc, lc, ['scenarios', i, 'name'])}: scenario name "${name}" is used twice`,
        file,
      );
    }
    names.add(name);
    const merged = { ...baseRaw } as Record<string, unknown>;
    delete merged.scenarios;
    for (const key of OVERRIDABLE) {
      if (!(key in sc)) continue;
      // An outlet, or a nitrate section naming another model, replaces the base's whole.
      const model = (x: unknown) => (x as { model?: unknown } | null | undefined)?.model;
      const whole =
        key === 'outlet' ||
        (key === 'nitrate' &&
          model(sc.nitrate) !== undefined &&
          model(sc.nitrate) !== model(baseRaw.nitrate));
      merged[key] = whole ? sc[key] : mergeOverrides(baseRaw[key], sc[key]);
    }
    const r = fieldSchema.safeParse(merged);
    if (!r.success) {
      const issue = firstIssue(r.error.issues);
      const top = String(issue.path[0]);
      // Locate in the scenario when it set that key, else in the base.
      const inScenario =
        top in sc &&
        doc.getIn(['scenarios', i, ...issue.path.map((p) => p as string | number)], true);
      if (inScenario || (top in sc && issue.code === 'unrecognized_keys'))
        fail(issue, merged, ['scenarios', i], scenarioLabel(sc.name, i));
      fail(issue, merged, [], scenarioLabel(sc.name, i));
    }
    scenarios.push({
      name,
      description: sc.description as string | undefined,
      field: r.data as Field,
    });
  });
  const warnings = [
    ...outletWarnings(base, ''),
    ...scenarios.flatMap((sc) =>
      JSON.stringify(sc.field.outlet) === JSON.stringify(base.outlet)
        ? []
        : outletWarnings(sc.field, `scenario "${sc.name}": `),
    ),
  ];
  return { base, scenarios, text, ratingFits: {}, warnings: [...new Set(warnings)] };
}

/** How messages name a scenario: its name, else its 1-based place in the list. */
function scenarioLabel(name: unknown, i: number): string {
  return typeof name === 'string' && name !== '' ? `"${clip(name, 40)}"` : `number ${i + 1}`;
}

/** Read and validate a field file from disk, with changes to its base given outside it. */
export function readFieldFile(path: string, overrides: readonly FieldOverride[] = []): LoadedField {
  const text = readTextFile(path, 'field file');
  const loaded = parseField(text, path, overrides);
  // A rating given by observations is fitted now, from a file named relative to the field file.
  const fields = [loaded.base, ...loaded.scenarios.map((s) => s.field)];
  for (const f of fields) {
    const section = f.nitrate as unknown as Partial<RatingObservationsSection>;
    if (section.model !== 'rating' || typeof section.observations !== 'string') continue;
    const obsPath = resolve(dirname(path), section.observations);
    let obsText: string;
    try {
      obsText = readFileSync(obsPath, 'utf8');
    } catch {
      throw new TilefluxError(
        `nitrate.observations: cannot read ${section.observations} (looked for ${obsPath})`,
        path,
      );
    }
    const { config, fit } = ratingFromObservations(
      section as RatingObservationsSection,
      obsText,
      section.observations,
    );
    (f as { nitrate: unknown }).nitrate = config;
    loaded.ratingFits[section.observations] = fit;
  }
  // A drain system named by the field file gives the capacity its selected sizes deliver.
  fields.forEach((f, i) => {
    if (f.drains.system === undefined) return;
    const where =
      i === 0 ? 'drains.system' : `scenario ${loaded.scenarios[i - 1].name}: drains.system`;
    if (f.drains.capacity !== undefined || f.drains.pipe !== undefined) {
      throw new TilefluxError(
        `${where}: give drains.system, drains.capacity or drains.pipe, not more than one`,
        path,
      );
    }
    const systemPath = resolve(dirname(path), f.drains.system);
    f.drains.capacity = systemCapacityMmD(systemPath, f.drains.spacing, where, path);
  });
  return loaded;
}
