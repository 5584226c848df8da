// A realistic, invented ReportData for the report tests and the report benchmark: an invented
// field ("North Willow piece, Brackenfold Farm"), a few scenarios and years of synthetic daily
// series with a wet spring and a dry summer. Deterministic (seeded), plain JavaScript so that
// both vitest (against src/) and the benchmark (against dist/) can use it; the comparison
// function is passed in for the same reason.

/** Small seeded generator (LCG, Numerical Recipes constants) for repeatable noise. */
function lcg(seed) {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(1664525, s) + 1013904223) >>> 0;
    return s / 4294967296;
  };
}

function isoDates(fromYear, years) {
  const out = [];
  const t = Date.UTC(fromYear, 0, 1);
  const end = Date.UTC(fromYear + years, 0, 1);
  for (let ms = t; ms < end; ms += 86_400_000) out.push(new Date(ms).toISOString().slice(0, 10));
  return out;
}

const STANDARD = [
  {
    name: 'conventional',
    description: 'Free outlet, laterals at the usual depth and spacing',
    drainDepthM: 1.2,
    spacingM: 20,
    outlet: 'free',
    controlled: false,
  },
  {
    name: 'shallow',
    description: 'Shallower laterals placed closer together',
    drainDepthM: 0.8,
    spacingM: 13,
    outlet: 'free',
    controlled: false,
  },
  {
    name: 'controlled',
    description: 'Control structure holds the outlet up outside the cropping season',
    drainDepthM: 1.2,
    spacingM: 20,
    outlet: 'held at 0.5 m from 1 Nov to 31 Mar',
    controlled: true,
  },
];

/**
 * @param {{ years?: number, fromYear?: number, names?: string[], units?: 'si'|'us',
 *           compareScenarios: Function }} opts
 */
export function makeReportData(opts) {
  const years = opts.years ?? 3;
  const fromYear = opts.fromYear ?? 2001;
  const scenarios = STANDARD.map((s, i) => ({ ...s, name: opts.names?.[i] ?? s.name }));
  const dates = isoDates(fromYear, years);
  const n = dates.length;
  const wetThresholdM = 0.3;
  const rand = lcg(42);
  // Shared weather signal: a rain-driven wetness index that decays, so every scenario sees the
  // same wet and dry spells.
  const wetness = new Float64Array(n);
  const precipMm = new Float64Array(n);
  let w = 0.5;
  for (let i = 0; i < n; i++) {
    const doy = Number(dates[i].slice(5, 7)) * 30.4 + Number(dates[i].slice(8, 10));
    const season = 0.5 + 0.5 * Math.cos((2 * Math.PI * (doy - 90)) / 365);
    const rain = rand() < 0.3 ? rand() * 25 : 0;
    precipMm[i] = rain;
    w = Math.min(1, Math.max(0, w * 0.93 + 0.006 * rain + 0.03 * season - 0.01));
    wetness[i] = w;
  }
  const series = [];
  const annual = [];
  for (const s of scenarios) {
    const wt = new Float64Array(n);
    const outlet = new Float64Array(n);
    const flow = new Float64Array(n);
    const load = new Float64Array(n);
    const conc = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const month = Number(dates[i].slice(5, 7));
      const held = s.controlled && (month >= 11 || month <= 3);
      outlet[i] = held ? 0.5 : s.drainDepthM;
      // Water table: deep when dry, up near the surface when wet; held outlets keep it higher.
      const free = s.drainDepthM + 0.3 - (s.drainDepthM + 0.5) * wetness[i];
      wt[i] = Math.max(0.05, held ? Math.min(free, 0.35 + 0.3 * (1 - wetness[i])) : free);
      const head = Math.max(0, outlet[i] - wt[i]);
      flow[i] = (head * head * 8 * 20) / s.spacingM;
      conc[i] = 9 + 6 * Math.sin((2 * Math.PI * (month - 2)) / 12) + rand();
      load[i] = (flow[i] * conc[i]) / 100;
    }
    series.push({
      scenario: s.name,
      waterTableDepthM: wt,
      outletDepthM: outlet,
      drainflowMm: flow,
      no3LoadKgHa: load,
      no3ConcMgL: conc,
    });
    for (let y = fromYear; y < fromYear + years; y++) {
      const idx = [];
      for (let i = 0; i < n; i++) if (dates[i].startsWith(`${y}-`)) idx.push(i);
      const sum = (a) => idx.reduce((t, i) => t + a[i], 0);
      const grow = idx.filter((i) => {
        const m = Number(dates[i].slice(5, 7));
        return m >= 4 && m <= 10;
      });
      const f = sum(flow);
      const l = sum(load);
      annual.push({
        scenario: s.name,
        year: y,
        days: idx.length,
        precip_mm: 850 + (y % 3) * 40,
        snowmelt_mm: 60,
        ref_et_mm: 700,
        et_mm: 560 + 0.05 * f,
        runoff_mm: 30 + (s.controlled ? 8 : 0),
        drainflow_mm: f,
        seepage_mm: 15,
        storage_change_mm: 0,
        balance_error_mm: 0,
        wt_mean_depth_m: sum(wt) / idx.length,
        wt_shallowest_depth_m: Math.min(...idx.map((i) => wt[i])),
        wet_days: grow.filter((i) => wt[i] < wetThresholdM).length,
        aeration_stress_days: grow.filter((i) => wt[i] < 0.5).length,
        aeration_deficit_days: grow.reduce((t, i) => t + Math.max(0, (0.5 - wt[i]) / 0.5), 0),
        spring_fieldwork_days: 30 - (s.controlled ? 3 : 0),
        spring_window_days: 36, // 20 Apr - 25 May
        fall_fieldwork_days: 40 - (s.controlled ? 2 : 0),
        fall_window_days: 47, // 25 Sep - 10 Nov
        stress_days: 4,
        no3n_load_kg_ha: l,
        fwmc_mg_l: f > 0 ? (100 * l) / f : 0,
        runoff_n_kg_ha: 0.3,
        seepage_n_kg_ha: 0.1,
        n_balance_error_kg_ha: 0,
      });
    }
  }
  const comparison = opts.compareScenarios(annual, {
    baseline: scenarios[0].name,
    scenarios: scenarios.map((s) => ({ name: s.name, spacingM: s.spacingM })),
  });
  return {
    title: 'Drainage alternatives for the North Willow piece',
    generatedBy: 'tileflux 0.1.0',
    fieldName: 'North Willow piece, Brackenfold Farm',
    weatherFile: 'weather/brackenfold-synthetic.csv',
    climate: {
      precipMmPerYr: 880,
      refEtMmPerYr: 700,
      tmeanC: 10,
      source: 'GHCN-Daily export, station XX000BRACK, metric units',
    },
    period: { from: dates[0], to: dates[n - 1], years },
    baseline: scenarios[0].name,
    scenarios: scenarios.map(({ controlled: _c, ...s }) => s),
    comparison,
    annual,
    daily: { dates, precipMm, series },
    wetThresholdM,
    // Not the field-file defaults, so a report that printed defaults instead would be caught.
    measures: {
      threshold: wetThresholdM,
      growingSeason: { from: '04-01', to: '10-31' },
      aerationLayer: 0.25,
      aerationThreshold: 0.12,
      springWindow: { from: '04-20', to: '05-25' },
      fallWindow: { from: '09-25', to: '11-10' },
      surfaceLayer: 0.08,
      trafficabilityLimit: 0.85,
    },
    chartYear: fromYear + Math.min(1, years - 1),
    chartYearReason: 'wettest',
    windows: scenarios.flatMap((s, i) =>
      ['spring', 'fall'].map((window) => ({
        scenario: s.name,
        window,
        from: window === 'spring' ? '04-20' : '09-25',
        to: window === 'spring' ? '05-25' : '11-10',
        medianDepthM: 0.6 - 0.05 * i,
        p80DepthM: 0.8 - 0.05 * i,
        tooWetYears: i,
        years,
      })),
    ),
    balances: scenarios.map((s, i) => ({
      scenario: s.name,
      maxAnnualWaterErrorMm: 1e-9 * (i + 1),
      maxAnnualNitrogenErrorKgHa: 0,
    })),
    methods: [
      {
        topic: 'Drain flow',
        text: 'Hooghoudt steady-state equation applied daily with the midpoint head above the outlet.',
        source: 'Hooghoudt (1940); van der Molen & Wesseling (1991)',
      },
      {
        topic: 'Reference ET',
        text: 'Hargreaves equation from daily maximum and minimum temperature.',
        source: 'Allen et al. (1998), FAO-56 Eq. 52',
      },
      {
        topic: 'Nitrate',
        text: 'Load = flow x concentration / 100 <for flow in mm & C in mg/L>.',
        source: 'Mass balance',
      },
    ],
    units: opts.units ?? 'si',
  };
}
