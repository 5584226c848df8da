/**
 * Field files: YAML in, validated `Field` objects out, with every problem located by file, line
 * and column, and unknown keys answered with a "did you mean" suggestion.
 *
 * Scenarios are named overrides of the base field. They are merged into the base as plain data
 * (objects merge key by key, lists and values replace) and each merged field is validated with
 * the same schema, so a scenario cannot slip past a check the base must pass. The located error
 * messages come from yamlIssues.ts, which the system files use too.
 */
import { readFileSync } from 'node:fs';
import { readTextFile } from './files.js';
import { dirname, resolve } from 'node:path';
import type { z } from 'zod';
import { clip, TilefluxError } from '../errors.js';
import { fieldSchema, OVERRIDABLE, type Field } from '../scenarios/fieldSchema.js';
import { ratingFromObservations, type RatingObservationsSection } from '../nitrate/schema.js';
import type { RatingFit } from '../nitrate/types.js';
import { systemCapacityMmD } from './system.js';
import {
  acceptedKeys,
  describeIssue,
  firstIssue,
  locate,
  locatedIssue,
  readYamlMapping,
  suggest,
  type Path,
  type YamlSource,
} from './yamlIssues.js';

export { locate, locatedIssue, readYamlMapping, suggest, type Path, type YamlSource };

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
      ...(sc.description !== undefined && { description: sc.description as string }),
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
