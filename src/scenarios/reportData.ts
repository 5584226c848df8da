/**
 * From a run to what the report and the charts need: the comparison table, the daily series of
 * each scenario, balance closure, and the methods with their sources.
 */
import type { ReportData } from '../report/types.js';
import { ET_METHOD_SOURCE } from '../climate/referenceEt.js';
import { VERSION } from '../version.js';
import { compareScenarios, type ComparisonRow } from './compare.js';
import { wetnessSchema } from './fieldSchema.js';
import { windowWaterTable } from './windows.js';
import type { RunOutput } from './run.js';

/** The methods behind every number in a run, with their published sources. */
export function methodsOf(run: RunOutput): ReportData['methods'] {
  const models = [...new Set(run.scenarios.map((s) => s.spec.nitrate.model))];
  const ratings = run.scenarios.filter((s) => s.spec.nitrate.model === 'rating');
  const ratingNote = ratings.map((s) => {
    const c = s.spec.nitrate as Extract<typeof s.spec.nitrate, { model: 'rating' }>;
    const [lo, hi] = c.fitFlowRangeMm;
    return (
      `${s.spec.name}: C = ${c.a.toPrecision(3)} Q^${c.b.toPrecision(3)} for flows ${lo.toPrecision(2)} to ` +
      `${hi.toPrecision(3)} mm/d; ${s.nitrate.outOfRangeDays} days with flow outside that range used the edge concentration`
    );
  });
  const rating = ratings.length
    ? [
        {
          topic: 'Nitrate rating',
          text: ratingNote.join('. ') + '.',
          source:
            'Concentration-discharge rating fitted in log space (least squares, simple-statistics)',
        },
      ]
    : [];
  const methods: ReportData['methods'] = [
    {
      topic: 'Reference evapotranspiration',
      text: `${run.refEtMethod}; crop ET = Kc x ET0 with the FAO-56 single crop coefficient curve and the water-stress coefficient Ks (Eq. 84).`,
      source: `${ET_METHOD_SOURCE[run.refEtMethod]}; Allen et al. (1998), FAO Irrigation and Drainage Paper 56`,
    },
    {
      topic: 'Snow',
      text: 'Temperature-index (degree-day) accumulation and melt; no ET under snow cover.',
      source: 'Degree-day method (e.g. Martinec 1960; FAO-56 does not cover snow)',
    },
    {
      topic: 'Water balance of the drained profile',
      text: 'Each day precipitation = ET + surface runoff + drain flow + deep seepage + change in storage (snow, surface water, soil), closed every year. Soil storage is the root-zone depletion below field capacity plus the pore volume drained above a water table midway between the drains; the layered drainable porosity ties that volume to the water-table depth.',
      source:
        'Conservation of mass; drainable porosity (specific yield) as in Ritzema (1994), ILRI Publ. 16',
    },
    {
      topic: 'Drain outflow',
      text: 'Hooghoudt steady-state equation applied each sub-step with the midpoint head above the effective outlet level (drain or control-structure level), solved exactly over each step with the recharge; equivalent depth of the layer below the drains by van der Molen & Wesseling; Kirkham ponded-surface rate when the surface is ponded and the profile saturated, if larger; capped by the pipe capacity.',
      source:
        'Hooghoudt (1940); van der Molen & Wesseling (1991), Agric. Water Manage. 19; Kirkham (1957)',
    },
    {
      topic: 'Deep seepage',
      text: 'Darcy leakage through the restrictive layer: a constant rate plus a conductance times the head of the water table above that layer.',
      source: "Darcy's law (Darcy 1856) for a semi-pervious layer",
    },
    {
      topic: 'Nitrate-N',
      text: `Concentration model: ${models.join(', ')}. Load (kg N/ha) = drain flow (mm) x concentration (mg/L) / 100. The pool model balances fertilizer, mineralization (Q10), crop uptake, denitrification rising with saturation and temperature, and leaching.`,
      source:
        'See README "Nitrate models" and src/nitrate/defaults.ts for the source of each default',
    },
    {
      topic: 'Crop conditions',
      text: 'Aeration stress from the air-filled porosity of the upper root zone; days suitable for fieldwork from the water content of the surface layer against a trafficability limit, standing water and snow; wet days from the water-table depth; water-stress days from FAO-56 Ks. The top layers dry and rewet first. Definitions, windows and thresholds are in the glossary.',
      source:
        'Aeration limit about 10 % air by volume: Grable & Siemer (1968), Soil Sci. Soc. Am. Proc. 32; workability a little drier than field capacity: Earl (1997), Soil Till. Res. 40; Allen et al. (1998), FAO-56 Eq. 84',
    },
  ];
  const nitrateAt = methods.findIndex((m) => m.topic === 'Nitrate-N');
  methods.splice(nitrateAt + 1, 0, ...rating);
  return methods;
}

/** The wettest calendar year of the run (most precipitation), used by default for the water-table chart. */
export function wettestYear(run: RunOutput): number {
  const annual = run.scenarios[0]?.annual ?? [];
  let best = annual[0];
  for (const r of annual) if (r.precip_mm > best.precip_mm) best = r;
  return best ? best.year : Number(run.from.slice(0, 4));
}

/** The comparison rows of a run (one per scenario, baseline first as in the run). */
export function comparisonOf(run: RunOutput): ComparisonRow[] {
  return compareScenarios(
    run.scenarios.flatMap((s) => s.annual),
    {
      baseline: run.baseline,
      scenarios: run.scenarios.map((s) => ({
        name: s.spec.name,
        spacingM: s.spec.params.spacingM,
      })),
    },
  );
}

/**
 * Everything the report needs from a run.
 * @example reportDataOf(run, { fieldName: 'North field', weatherFile: 'w.csv', units: 'si' })
 */
export function reportDataOf(
  run: RunOutput,
  o: {
    fieldName: string;
    weatherFile: string;
    units: 'si' | 'us';
    chartYear?: number;
    comparison?: ComparisonRow[];
  },
): ReportData {
  const measures = run.scenarios[0]?.spec.field.wetness ?? wetnessSchema.parse(undefined);
  return {
    title: `Drainage alternatives for ${o.fieldName}`,
    generatedBy: `tileflux ${VERSION}`,
    fieldName: o.fieldName,
    weatherFile: o.weatherFile,
    period: { from: run.from, to: run.to, years: run.scenarios[0]?.annual.length ?? 0 },
    baseline: run.baseline,
    scenarios: run.scenarios.map((s) => ({
      name: s.spec.name,
      description: s.spec.description,
      drainDepthM: s.spec.params.drainDepthM,
      spacingM: s.spec.params.spacingM,
      outlet: s.spec.outletLabel,
    })),
    comparison: o.comparison ?? comparisonOf(run),
    annual: run.scenarios.flatMap((s) => s.annual),
    daily: {
      dates: run.forcing.dates,
      series: run.scenarios.map((s) => ({
        scenario: s.spec.name,
        waterTableDepthM: s.engine.waterTableDepthM,
        outletDepthM: s.engine.outletDepthM,
        drainflowMm: s.engine.drainflowMm,
        no3LoadKgHa: s.nitrate.loadKgHa,
        no3ConcMgL: s.nitrate.concMgL,
      })),
    },
    wetThresholdM: measures.threshold,
    measures,
    chartYear: o.chartYear ?? wettestYear(run),
    chartYearReason: o.chartYear === undefined ? 'wettest' : 'given',
    windows: run.scenarios.flatMap((s) =>
      windowWaterTable(
        s.spec.name,
        run.forcing.dates,
        s.engine.waterTableDepthM,
        s.annual,
        measures,
      ),
    ),
    balances: run.scenarios.map((s) => ({
      scenario: s.spec.name,
      maxAnnualWaterErrorMm: Math.max(0, ...s.annual.map((r) => Math.abs(r.balance_error_mm))),
      maxAnnualNitrogenErrorKgHa: Math.max(
        0,
        ...s.annual.map((r) => Math.abs(r.n_balance_error_kg_ha)),
      ),
    })),
    methods: methodsOf(run),
    units: o.units,
  };
}
