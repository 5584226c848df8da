/**
 * The starter field file written by `tileflux init`: an example field whose every key carries
 * the description, unit and default from the schema as a comment, with the optional keys it does
 * not set shown commented out. Generated from the schema, so it cannot drift from validation.
 */
import { z } from 'zod';
import { stringify } from 'yaml';
import { fieldSchema } from './fieldSchema.js';

interface JsonSchema {
  description?: string;
  default?: unknown;
  properties?: Record<string, JsonSchema>;
  required?: string[];
  type?: string | string[];
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  const?: unknown;
}

/** The example every starter file begins from (an invented field). */
export const STARTER_EXAMPLE = {
  name: 'Example north field',
  site: { latitude: 42.1, elevation: '250 m' },
  soil: {
    conductivity: '1.0 m/d',
    restrictiveLayerDepth: '2.5 m',
    drainablePorosity: 0.05,
    fieldCapacity: 0.3,
    wiltingPoint: 0.14,
    surfaceStorage: '10 mm',
  },
  drains: {
    depth: '1.2 m',
    spacing: '20 m',
    radius: '0.05 m',
    coefficient: { soil: 'mineral', crop: 'field', inlets: 'none' },
  },
  seepage: 'medium',
  outlet: 'free',
  crops: { rotation: ['corn', 'soybean'] },
  initial: { waterTableDepth: '0.8 m' },
};

/** Commented examples of optional sections that have no defaults to show. */
const COMMENTED_EXAMPLES: Record<string, string[]> = {
  sweep: [
    'sweep:',
    '  depth: [0.75 m, 0.9 m, 1.05 m, 1.2 m]          # a list, or { from, to, step }',
    '  spacing: { from: 10 m, to: 30 m, step: 2 m }',
    '  outlet:                                         # named managements',
    '    free: free',
    "    winter hold: { schedule: [ { from: '10-25', depth: 0.3 m }, { from: '04-05', depth: free } ] }",
    '  uncertain:                                      # sampled by Latin hypercube, seeded',
    '    soil.conductivity: { low: 0.4 m/d, high: 1.6 m/d, scale: log }',
    '    soil.drainablePorosity: { low: 0.03, high: 0.07 }',
    '  samples: 40',
  ],
  costs: [
    'costs:                                            # illustrative defaults shown; use local prices',
    '  currency: USD',
    '  lateral: 3.0 /m                                 # installed, per metre of lateral',
    '  main: 0.15 of lateral                           # or { cost: 8 /m, lengthPerHa: 40 m }',
    '  controlStructure: { each: 2000, drainsArea: 8 ha }',
    '  lifeYears: 25',
    '  discountRate: 4 %',
  ],
};

function objectSchema(s: JsonSchema | undefined): JsonSchema | undefined {
  if (!s) return undefined;
  if (s.properties) return s;
  for (const alt of s.anyOf ?? []) {
    const o = objectSchema(alt);
    if (o) return o;
  }
  return undefined;
}

function scalarText(v: unknown): string {
  return stringify(v, { collectionStyle: 'flow' }).trim();
}

function emit(
  schema: JsonSchema,
  value: Record<string, unknown> | undefined,
  resolved: Record<string, unknown> | undefined,
  indent: string,
  out: string[],
): void {
  for (const [key, prop] of Object.entries(schema.properties ?? {})) {
    const desc = prop.description ?? '';
    const required = schema.required?.includes(key) && prop.default === undefined;
    const v = value?.[key];
    const child = objectSchema(prop);
    // Defaults of quantity keys are not in the JSON schema (they sit behind a transform), so the
    // value the schema resolves for the example stands in for them.
    const dflt = prop.default ?? resolved?.[key];
    if (desc) out.push(`${indent}# ${desc}${required ? ' (required)' : ''}`);
    const alternatives = (prop.oneOf ?? []).filter((a) => a.properties?.model?.const !== undefined);
    if (v === undefined && alternatives.length > 1) {
      // A choice of models: list each with its keys, all commented out.
      for (const alt of alternatives) {
        out.push(`${indent}# ${key}:`);
        for (const [k, sub] of Object.entries(alt.properties ?? {})) {
          const val = k === 'model' ? String(alt.properties?.model?.const) : '';
          out.push(
            `${indent}#   ${k}: ${val}`.trimEnd() +
              (sub.description && k !== 'model' ? `   # ${sub.description}` : ''),
          );
        }
      }
      continue;
    }
    if (v !== undefined) {
      if (child && typeof v === 'object' && v !== null && !Array.isArray(v)) {
        out.push(`${indent}${key}:`);
        emit(
          child,
          v as Record<string, unknown>,
          resolved?.[key] as Record<string, unknown>,
          indent + '  ',
          out,
        );
      } else {
        const text = stringify({ [key]: v }, { collectionStyle: 'block' })
          .replace(/\n$/, '')
          .trimEnd();
        out.push(...text.split('\n').map((l) => indent + l));
      }
    } else if (key in COMMENTED_EXAMPLES) {
      out.push(...COMMENTED_EXAMPLES[key].map((l) => `${indent}# ${l}`));
    } else if (key === 'scenarios') {
      out.push(`${indent}# scenarios:`);
      out.push(`${indent}#   - { name: conventional }`);
      out.push(`${indent}#   - { name: shallow, drains: { depth: 0.75 m, spacing: 12 m } }`);
      out.push(`${indent}#   - name: controlled`);
      out.push(
        `${indent}#     outlet: { boardHeight: 6 in, schedule: [ { from: "11-01", depth: 0.3 m }, { from: "04-01", depth: free } ] }`,
      );
    } else if (child && dflt !== undefined && typeof dflt === 'object') {
      out.push(`${indent}# ${key}:`);
      const lines: string[] = [];
      emit(
        child,
        dflt as Record<string, unknown>,
        dflt as Record<string, unknown>,
        indent + '  ',
        lines,
      );
      out.push(...lines.map((l) => `${indent}# ${l.slice(indent.length)}`));
    } else if (dflt !== undefined) {
      out.push(...`${key}: ${scalarText(dflt)}`.split('\n').map((l) => `${indent}# ${l}`));
    } else {
      out.push(`${indent}# ${key}:`);
    }
  }
}

/**
 * The text of a fully commented starter field file.
 * @example starterFieldFile().startsWith('# tileflux field file') // true
 */
export function starterFieldFile(): string {
  const schema = z.toJSONSchema(fieldSchema, { io: 'input', unrepresentable: 'any' }) as JsonSchema;
  const out: string[] = [
    '# tileflux field file: one drained field, its drain layout and its management.',
    '# Quantities take unit strings ("1.2 m", "48 in", "0.5 in/d", "2 in/h"); a bare number is in the',
    '# unit shown in brackets. Commented keys show their defaults; uncomment to change them.',
    '# Check it with: tileflux run FIELD --weather WEATHER.csv',
    '# Planning estimates only: local drainage guides, practice standards, permits and a licensed',
    '# professional decide the design.',
    '',
  ];
  const resolved = fieldSchema.parse(STARTER_EXAMPLE) as Record<string, unknown>;
  emit(schema, STARTER_EXAMPLE as Record<string, unknown>, resolved, '', out);
  return out.join('\n') + '\n';
}
