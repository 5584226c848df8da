/**
 * The prose sections of the run report: the climate of the period, the alternatives, the chart
 * year, the outlet schedule (with stop-log boards), the glossary, the methods with their
 * sources and the balance closure. Pure: report data in, escaped HTML out.
 */
import { counted, fixed } from './format.js';
import { boardTable } from '../scenarios/boards.js';
import type { ReportData } from './types.js';
import { displayUnits } from './units.js';
import { escapeHtml } from './htmlPage.js';
import { dayMonth, shown, windowText } from './runTables.js';

/** Largest annual balance residual reported as closed (the engine closes it to 1e-6 mm per year). */
export const BALANCE_TOLERANCE = { waterMm: 1e-6, nitrogenKgHa: 1e-6 } as const;
/**
 * The climate the comparison holds for, in words and in the report's units, e.g. "precipitation
 * 880 mm/yr, reference ET 702 mm/yr, mean air temperature 9.3 °C; GHCN-Daily, station X".
 */
export function climateText(data: Pick<ReportData, 'climate' | 'units'>): string {
  const du = displayUnits(data.units);
  const c = data.climate;
  const water = (mm: number) => `${shown(mm, du.water)} ${du.water.label}/yr`;
  const temp =
    data.units === 'us' ? `${fixed(c.tmeanC * 1.8 + 32, 1)} °F` : `${fixed(c.tmeanC, 1)} °C`;
  return (
    `precipitation ${water(c.precipMmPerYr)}, reference ET ${water(c.refEtMmPerYr)}, ` +
    `mean air temperature ${temp}` +
    (c.source ? `; ${c.source}` : '')
  );
}
/** What the run compares, from the scenarios themselves: one phrase per alternative. */
export function alternativesText(data: ReportData): {
  lines: string[];
  layout: boolean;
  outlet: boolean;
} {
  const du = displayUnits(data.units);
  const len = (x: number, d: number) =>
    `${shown(x, { ...du.length, decimals: d })} ${du.length.label}`;
  const base = data.scenarios.find((s) => s.name === data.baseline);
  let layout = false;
  let outlet = false;
  const lines = data.scenarios
    .filter((s) => s.name !== data.baseline)
    .map((s) => {
      const parts: string[] = [];
      if (base && (s.drainDepthM !== base.drainDepthM || s.spacingM !== base.spacingM)) {
        layout = true;
        parts.push(
          `drains ${len(s.drainDepthM, 2)} deep and ${len(s.spacingM, 1)} apart instead of ` +
            `${len(base.drainDepthM, 2)} and ${len(base.spacingM, 1)}`,
        );
      }
      if (base && s.outlet !== base.outlet) {
        outlet = true;
        parts.push(`outlet ${s.outlet} instead of ${base.outlet}`);
      }
      return `${s.name}: ${parts.length ? parts.join('; ') : 'the same layout and outlet'}`;
    });
  return { lines, layout, outlet };
}
/** Why the water-table chart shows the year it shows. */
export function chartYearText(data: ReportData): string {
  return data.chartYearReason === 'given'
    ? `The daily charts show ${data.chartYear}, the year asked for (tileflux run --year).`
    : `The daily charts show ${data.chartYear}, the wettest year of the record (the most ` +
        `precipitation); choose another with tileflux run --year.`;
}
/** A step date in words: "25 Oct" for a yearly step, "25 Oct 2015" for a dated one. */
export function stepDate(from: string): string {
  return from.length === 5 ? dayMonth(from) : `${dayMonth(from.slice(5))} ${from.slice(0, 4)}`;
}
/** "3 boards", "1 board". */
export function boardsText(n: number): string {
  return counted(Math.abs(n), 'board');
}
/**
 * The outlet schedule of every scenario with a control structure: dates, levels and, when the
 * field gives a board height, boards standing and boards to add or take out on each date.
 * Empty when every outlet is free.
 */
export function outletScheduleTable(data: ReportData): string {
  const du = displayUnits(data.units);
  const level = (m: number) => `${shown(m, { ...du.length, decimals: 2 })} ${du.length.label}`;
  const managed = data.scenarios.filter((s) => s.outletSteps && s.outletSteps.length > 0);
  if (managed.length === 0) return '';
  const withBoards = managed.some((s) => s.boardHeightM !== undefined);
  const rows = managed.flatMap((s) => {
    const table = boardTable(s.outletSteps!, s.drainDepthM, s.boardHeightM);
    return table.map((r, k) => {
      const free = r.levelM === null || r.levelM >= s.drainDepthM;
      const asked = free ? 'free' : shown(r.levelM, { ...du.length, decimals: 2 });
      let action: string;
      if (r.change !== null) {
        action =
          r.change > 0
            ? `add ${boardsText(r.change)}`
            : r.change < 0
              ? r.boards === 0
                ? `take out all ${boardsText(r.change)} (free outlet)`
                : `take out ${boardsText(r.change)}`
              : 'no change';
      } else {
        action = free ? 'free the outlet' : `set the outlet to ${level(r.levelM!)}`;
      }
      const boards =
        r.boards === null
          ? withBoards
            ? '<td class="text">no board height given</td>'
            : ''
          : `<td class="text">${boardsText(r.boards)}` +
            (r.levelM !== null && r.boards > 0 && Math.abs(r.boardLevelM! - r.levelM) > 0.005
              ? ` (outlet at ${escapeHtml(level(r.boardLevelM!))})`
              : '') +
            `</td>`;
      return (
        `<tr>${k === 0 ? `<th scope="row" rowspan="${table.length}">${escapeHtml(s.name)}</th>` : ''}` +
        `<td class="text">${escapeHtml(stepDate(r.from))}</td>` +
        `<td class="text">${escapeHtml(asked)}</td>${boards}` +
        `<td class="text">${escapeHtml(action)}</td></tr>`
      );
    });
  });
  const heights = managed
    .filter((s) => s.boardHeightM !== undefined)
    .map((s) => {
      const h =
        data.units === 'us'
          ? `${fixed(s.boardHeightM! / 0.0254, 1)} in`
          : `${fixed(s.boardHeightM! * 100, 1)} cm`;
      return `${s.name}: boards ${h} high`;
    });
  return (
    `<table class="keep" id="outlet-table"><caption>The control structure through the year. ` +
    `Dates given as day and month repeat every year; the level is the outlet's height below the ` +
    `surface (free: at the drains). ` +
    (withBoards
      ? `Boards are counted up from the outlet pipe at drain depth, rounded to whole boards ` +
        `(${escapeHtml(heights.join('; '))}).`
      : `Give outlet.boardHeight in the field file (e.g. 6 in) to see the schedule in boards.`) +
    `</caption><thead><tr><th scope="col">Scenario</th><th scope="col">From</th>` +
    `<th scope="col">Outlet level <span class="unit">(${du.length.label} below surface)</span></th>` +
    (withBoards ? `<th scope="col">Boards standing</th>` : '') +
    `<th scope="col">On that date</th></tr></thead>\n<tbody>\n${rows.join('\n')}\n</tbody></table>`
  );
}
/** The glossary: every measure in the tables, with the windows and thresholds of this run. */
export function glossary(data: ReportData): string {
  const du = displayUnits(data.units);
  const m = data.measures;
  const len = (x: number) => `${shown(x, { ...du.length, decimals: 2 })} ${du.length.label}`;
  const pct = (x: number) => `${fixed(100 * x, 0)} %`;
  const season = `the growing season (${windowText(m.growingSeason)})`;
  const entries: Array<[string, string]> = [
    [
      'Drain flow',
      "Water leaving through the drains, as a depth over the drained area, from Hooghoudt's " +
        "equation (Kirkham's when the surface is ponded) and the outlet level in force.",
    ],
    ['Surface runoff', 'Water running off once the depression storage on the surface is full.'],
    [
      'Deep seepage',
      'Water leaking down through the restrictive layer to the regional groundwater (Darcy leakage).',
    ],
    [
      'Evapotranspiration (ET)',
      'Water returned to the air by the crop and the soil surface (FAO-56 crop coefficient and ' +
        'water-stress coefficient).',
    ],
    [
      'Nitrate-N load',
      `Nitrate-N leaving with drain water, ${du.load.label}: drain flow times its concentration.`,
    ],
    [
      'Flow-weighted concentration',
      'Total nitrate-N load divided by total drain flow over the period, mg/L.',
    ],
    [
      'Aeration-stress days',
      `Days in ${season} on which the air-filled porosity of the top ${len(m.aerationLayer)} ` +
        `is below ${pct(m.aerationThreshold)} by volume, the usual limit below which roots lack ` +
        'oxygen. Air-filled porosity is the pore space drained above the water table within that ' +
        'layer (its drainable porosity) plus the water the crop has taken from it below field ' +
        "capacity, over the layer's volume.",
    ],
    [
      'Aeration deficit',
      'How severe the aeration stress was: each aeration-stress day adds its shortfall of air as ' +
        'a share of the limit (1 when the layer holds no air, 0.5 at half the limit), summed over ' +
        'the season. Unit: days without air; ten days at half the limit count 5.',
    ],
    [
      'Water-stress days',
      `Days in ${season} on which the root zone is dry enough to hold transpiration below its ` +
        'potential (FAO-56 water-stress coefficient Ks below 1).',
    ],
    [
      'Wet days',
      `Days in ${season} with the water table midway between the drains shallower than ` +
        `${len(m.threshold)}.`,
    ],
    [
      'Spring and fall fieldwork days',
      `Days suitable for fieldwork in the spring window (${windowText(m.springWindow)}) and the ` +
        `fall window (${windowText(m.fallWindow)}): the top ${len(m.surfaceLayer)} holds at most ` +
        `${pct(m.trafficabilityLimit)} of its field-capacity water content, no water stands on the ` +
        'surface and no snow covers it. Counts are given with the length of the window ' +
        '("31 of 47 days").',
    ],
    [
      'Mean water-table depth',
      'Depth of the water table midway between the drains below the surface, averaged over the year.',
    ],
  ];
  return (
    `<dl class="glossary" id="glossary">` +
    entries.map(([t, d]) => `<dt>${escapeHtml(t)}</dt><dd>${escapeHtml(d)}</dd>`).join('\n') +
    `</dl>`
  );
}
export function methodsTable(data: ReportData): string {
  const body = data.methods
    .map(
      (m) =>
        `<tr><th scope="row">${escapeHtml(m.topic)}</th><td class="text">${escapeHtml(m.text)}</td>` +
        `<td class="text">${escapeHtml(m.source)}</td></tr>`,
    )
    .join('\n');
  return (
    `<table class="methods" id="methods-table"><thead><tr><th scope="col">Topic</th>` +
    `<th scope="col" class="text">Method and assumptions</th><th scope="col" class="text">Source</th>` +
    `</tr></thead>\n<tbody>\n${body}\n</tbody></table>`
  );
}
export function closed(x: number, tol: number): string {
  return Math.abs(x) <= tol
    ? '<span class="ok">closed</span>'
    : '<span class="bad">not closed</span>';
}
export function balanceTable(data: ReportData): string {
  const du = displayUnits(data.units);
  const body = data.balances
    .map(
      (b) =>
        `<tr><th scope="row">${escapeHtml(b.scenario)}</th>` +
        `<td>${(b.maxAnnualWaterErrorMm * du.water.factor).toExponential(1)}</td><td>${closed(b.maxAnnualWaterErrorMm, BALANCE_TOLERANCE.waterMm)}</td>` +
        `<td>${(b.maxAnnualNitrogenErrorKgHa * du.load.factor).toExponential(1)}</td>` +
        `<td>${closed(b.maxAnnualNitrogenErrorKgHa, BALANCE_TOLERANCE.nitrogenKgHa)}</td></tr>`,
    )
    .join('\n');
  return (
    `<table class="balances keep" id="balance-table"><thead><tr><th scope="col">Scenario</th>` +
    `<th scope="col">Largest annual water-balance residual <span class="unit">(${du.water.label})</span></th>` +
    `<th scope="col">Water</th>` +
    `<th scope="col">Largest annual nitrogen-balance residual <span class="unit">(${du.load.label})</span></th>` +
    `<th scope="col">Nitrogen</th></tr></thead>\n<tbody>\n${body}\n</tbody></table>`
  );
}
