/**
 * The field file's `sweep:` and `costs:` sections: which designs a study runs (drain depths x
 * spacings x named outlet managements), which soil values are uncertain and sampled, and what a
 * design costs. Validated like the rest of the field file; `tileflux init` shows them.
 *
 * Cost defaults are illustrative, not prices: they only let a first study rank designs by cost.
 * Basis (common practice, from memory): installed pattern drainage in the US Midwest in the
 * 2010s-2020s cost roughly US$700-1,200 per acre at 40-60 ft lateral spacing, i.e. about US$3
 * per metre of installed lateral; mains and submains add some 10-20 % of the lateral cost on a
 * regular layout; an in-line control structure costs US$1,500-3,000 installed and manages some
 * 5-10 ha on flat land; plastic drain tubing serves for decades, and 25 years is a conservative
 * economic life; 4 % is a real discount rate of the size used in public conservation
 * evaluations. Put local prices in the field file.
 */
import { z } from 'zod';
import { DECIMAL_NUMBER } from '../units/decimal.js';
import { US } from '../units/quantity.js';
import { zQuantity } from '../units/zodQuantity.js';

const PER_M = new RegExp(
  String.raw`^\s*(${DECIMAL_NUMBER})\s*/\s*(m|metre|meter|ft|foot|feet)\s*$`,
  'i',
);
const OF_LATERAL = new RegExp(String.raw`^\s*(${DECIMAL_NUMBER})\s*(%?)\s*of\s+lateral\s*$`, 'i');

/** A list of lengths, or an evenly spaced range { from, to, step } (both ends included). */
function lengthValues(what: string, bounds: { min: number; max: number }) {
  const q = (d: string) => zQuantity('length', d, bounds);
  return z
    .union([
      z.array(q(what)).min(1).max(200),
      z.strictObject({
        from: q(`First ${what.toLowerCase()}`),
        to: q(`Last ${what.toLowerCase()} (included when the steps reach it)`),
        step: zQuantity('length', 'Step between values', { min: 0, exclusiveMin: true }),
      }),
    ])
    .transform((v, ctx) => {
      if (Array.isArray(v)) return [...new Set(v)].sort((a, b) => a - b);
      if (v.to < v.from) {
        ctx.addIssue({
          code: 'custom',
          message: `to (${v.to} m) must not lie before from (${v.from} m)`,
        });
        return z.NEVER;
      }
      const n = Math.floor((v.to - v.from) / v.step + 1e-9) + 1;
      if (n > 200) {
        ctx.addIssue({ code: 'custom', message: `gives ${n} values; at most 200 are accepted` });
        return z.NEVER;
      }
      return Array.from({ length: n }, (_, k) => Math.round((v.from + k * v.step) * 1e9) / 1e9);
    })
    .describe(`${what}: a list such as [0.9 m, 1.2 m], or { from, to, step } [m]`);
}

/** An uncertain soil value: sampled between low and high, evenly or evenly in its logarithm. */
export const uncertainSchema = z.strictObject({
  low: z.union([z.number(), z.string()]).describe('Lowest value, in the unit of the soil key'),
  high: z.union([z.number(), z.string()]).describe('Highest value, in the unit of the soil key'),
  scale: z
    .enum(['linear', 'log'])
    .default('linear')
    .describe('linear: even between low and high; log: even in the logarithm (conductivities)'),
});

export const sweepSchema = z
  .strictObject({
    depth: lengthValues('Drain depths', { min: 0.2, max: 5 }),
    spacing: lengthValues('Lateral spacings', { min: 1, max: 500 }),
    uncertain: z
      .record(z.string(), uncertainSchema)
      .default({})
      .describe(
        'Uncertain soil values sampled by Latin hypercube, keyed soil.<key>, e.g. soil.conductivity: { low: 0.4 m/d, high: 1.6 m/d, scale: log }',
      ),
    samples: z
      .number()
      .int()
      .min(1)
      .max(10000)
      .default(1)
      .describe('Soil samples per design (Latin hypercube; --samples overrides)'),
  })
  .describe('Designs a study sweeps (tileflux sweep): depth x spacing x outlet management');

/** Names of outlet managements in a sweep. */
export const managementName = z.string().min(1).max(60);

/**
 * Checks of a sweep against the rest of the field: each uncertain key names a numeric soil key
 * and its low and high values pass that key's own schema, in order; every swept drain depth lies
 * above the restrictive layer (at its lowest sampled depth) by more than the drain radius.
 */
export function checkSweep(
  f: {
    soil: { restrictiveLayerDepth: number };
    drains: { radius: number };
    sweep?: SweepSection | undefined;
  },
  soilShape: Record<string, z.ZodType>,
  addIssue: (path: Array<string | number>, message: string) => void,
): void {
  const sw = f.sweep;
  if (!sw) return;
  let barrier = f.soil.restrictiveLayerDepth;
  for (const [key, u] of Object.entries(sw.uncertain)) {
    const path = ['sweep', 'uncertain', key];
    const m = /^soil\.(\w+)$/.exec(key);
    const schema = m ? soilShape[m[1]] : undefined;
    if (!schema) {
      addIssue(
        path,
        `"${key}" is not a soil value; uncertain keys are soil.<key> such as soil.conductivity`,
      );
      continue;
    }
    const values: number[] = [];
    for (const end of ['low', 'high'] as const) {
      const r = schema.safeParse(u[end]);
      if (!r.success || typeof r.data !== 'number') {
        const why = r.success ? 'expects one number' : r.error.issues[0]?.message;
        addIssue([...path, end], `${why ?? 'is not accepted'}`);
        return;
      }
      values.push(r.data);
    }
    if (values[1] < values[0]) addIssue([...path, 'high'], `must not be below low (${u.low})`);
    if (u.scale === 'log' && !(values[0] > 0))
      addIssue([...path, 'low'], 'must be above 0 on a log scale');
    if (m![1] === 'restrictiveLayerDepth') barrier = Math.min(barrier, values[0]);
  }
  const deepest = Math.max(...sw.depth);
  if (barrier - deepest <= f.drains.radius) {
    addIssue(
      ['sweep', 'depth'],
      `the deepest drains (${deepest} m) must lie above the restrictive layer (${barrier} m at its ` +
        `shallowest) by more than the drain radius (${f.drains.radius} m)`,
    );
  }
}

/** A cost per metre: a number, or "3.0 /m", "0.9 /ft". */
const perMetre = (description: string) =>
  z
    .union([z.number().min(0), z.string()])
    .transform((v, ctx) => {
      if (typeof v === 'number') return v;
      const m = PER_M.exec(v);
      const x = m ? Number(m[1]) / (/^f/i.test(m[2]) ? US.mPerFt : 1) : NaN;
      if (!(x >= 0)) {
        ctx.addIssue({
          code: 'custom',
          message: `expects a cost per length such as 3.0 /m or 0.9 /ft; got ${v}`,
        });
        return z.NEVER;
      }
      return x;
    })
    .describe(`${description} [currency per m; e.g. 3.0 /m or 0.9 /ft]`);

export const COST_DEFAULTS = {
  currency: 'USD',
  lateral: 3.0,
  main: 0.15,
  controlStructure: { each: 2000, drainsArea: 8 },
  lifeYears: 25,
  discountRate: 0.04,
} as const;

export const costsSchema = z
  .strictObject({
    currency: z
      .string()
      .regex(/^[A-Za-z][A-Za-z0-9]{0,9}$/, 'expects a currency label such as USD or EUR')
      .default(COST_DEFAULTS.currency)
      .describe('Currency label of every cost (a label only: nothing is converted)'),
    lateral: perMetre('Installed cost of lateral drain per metre').default(COST_DEFAULTS.lateral),
    main: z
      .union([
        z.number().min(0).max(10),
        z.string(),
        z.strictObject({
          cost: perMetre('Installed cost of main per metre'),
          lengthPerHa: zQuantity('length', 'Metres of main per hectare of field', {
            min: 0,
            max: 10000,
          }),
        }),
      ])
      .transform((v, ctx) => {
        if (typeof v === 'number') return { ofLateral: v };
        if (typeof v === 'object') return { perHa: v.cost * v.lengthPerHa };
        const m = OF_LATERAL.exec(v);
        const x = m ? Number(m[1]) / (m[2] ? 100 : 1) : NaN;
        if (!(x >= 0 && x <= 10)) {
          ctx.addIssue({
            code: 'custom',
            message: `expects a share such as "0.15 of lateral", or { cost: 8 /m, lengthPerHa: 40 m }; got ${v}`,
          });
          return z.NEVER;
        }
        return { ofLateral: x };
      })
      .default({ ofLateral: COST_DEFAULTS.main })
      .describe(
        'Mains and submains: a share of the lateral cost ("0.15 of lateral") or { cost, lengthPerHa } of a layout',
      ),
    controlStructure: z
      .strictObject({
        each: z.number().min(0).describe('Installed cost of one control structure [currency]'),
        drainsArea: zQuantity('area', 'Field area one structure manages', {
          min: 0,
          exclusiveMin: true,
          max: 10000,
        }),
      })
      .default({ ...COST_DEFAULTS.controlStructure })
      .describe('Control structures, needed by every managed (not free) outlet'),
    lifeYears: z
      .number()
      .int()
      .min(1)
      .max(100)
      .default(COST_DEFAULTS.lifeYears)
      .describe('Economic life over which the installation is annualised [years]'),
    discountRate: zQuantity('fraction', 'Real discount rate per year', {
      min: 0,
      max: 0.5,
    }).default(COST_DEFAULTS.discountRate),
  })
  .describe(
    'Installed costs of a design (illustrative defaults; put local prices here), annualised by the capital recovery factor',
  );

export type SweepSection = z.output<typeof sweepSchema> & {
  outlet: Record<string, unknown>;
};
export type CostsSection = z.output<typeof costsSchema>;
