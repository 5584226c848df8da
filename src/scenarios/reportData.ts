/**
 * From a run to what the report and the charts need: the comparison table, the daily series of
 * each scenario, balance closure, and the methods with their sources.
 */
import type { ReportData } from '../report/types.js';
import { ET_METHOD_SOURCE } from '../climate/referenceEt.js';
import { VERSION } from '../version.js';
import { compareScenarios, type ComparisonRow } from './compare.js';
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
      topic: 'Drain outflow',
      text: 'Hooghoudt steady-state equation applied each sub-step with the midpoint head above the effective outlet level (drain or control-structure level), solved exactly over each step with the recharge; equivalent depth by van der Molen & Wesseling; Kirkham rate when the surface is ponded; capped by the pipe capacity.',
      source:
        'Hooghoudt (1940); van der Molen & Wesseling (1991); Kirkham (1957); Ritzema (1994), ILRI Publ. 16',
    },
    {
      topic: 'Water table',
      text: 'Field-average water table from stored water and drainable porosity (layered); taken as the midpoint depth (flat-water-table storage).',
      source: 'Drainage-volume approach (Skaggs 1980)',
    },
    {
      topic: 'Deep seepage',
      text: 'A constant rate plus a conductance times the head of the water table above the restrictive layer.',
      source: 'Darcy flow through a leaky layer',
    },
    {
      topic: 'Nitrate-N',
      text: `Concentration model: ${models.join(', ')}. Load (kg N/ha) = drain flow (mm) x concentration (mg/L) / 100. The pool model balances fertilizer, mineralization (Q10), crop uptake, denitrification rising with saturation and temperature, and leaching.`,
      source:
        'See README "Nitrate models" and src/nitrate/defaults.ts for the source of each default',
    },
    {
      topic: 'Wetness measures',
      text: 'Wet days: growing-season days with the midpoint water table shallower than the threshold; excess wetness: the sum of (threshold - depth) in cm over those days; ready days: days in the planting or harvest window with the water table at least the ready depth, no ponding and little rain.',
      source: 'tileflux definitions (thresholds set in the field file)',
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
    wetThresholdM: run.scenarios[0]?.spec.field.wetness.threshold ?? 0.3,
    chartYear: o.chartYear ?? wettestYear(run),
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
