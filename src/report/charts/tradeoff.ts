/** The load/wetness trade-off of the scenarios, with labels placed so they do not overlap. Pure. */
import type { TopLevelSpec } from 'vega-lite';
import type { ReportData } from '../types.js';
import { displayUnits } from '../units.js';
import { VEGA_LITE_SCHEMA, CONFIG, roundTo } from '../chartTheme.js';
import { scenarioNames, scenarioColour } from '../chartSeries.js';

/**
 * Load against wetness: one labelled point per scenario at its mean annual growing-season wet
 * days and mean annual nitrate-N load (from the comparison table).
 *
 * @example tradeoffChart(data).layer.length // 2
 */
export function tradeoffChart(data: ReportData): TopLevelSpec {
  const du = displayUnits(data.units);
  const names = scenarioNames(data);
  const points = names.map((name) => {
    const c = data.comparison.find((r) => r.scenario === name);
    if (!c) throw new Error(`report data has no comparison row for scenario "${name}"`);
    return {
      scenario: name,
      label: c.is_baseline ? `${name} (baseline)` : name,
      wet: roundTo(c.wet_days, 2),
      load: roundTo(c.no3n_load_kg_ha * du.load.factor, 3),
    };
  });
  // Both axes start at zero and end on a round number; the wetness axis has room on the right
  // for the labels and a minimum span so that all-dry scenarios still get a readable axis.
  const wetMax = niceCeil(Math.max(5, 1.3 * Math.max(...points.map((v) => v.wet))));
  const loadMax = niceCeil(Math.max(1, 1.1 * Math.max(...points.map((v) => v.load))));
  const values = placeLabels(points, wetMax, loadMax);
  const x = {
    field: 'wet',
    type: 'quantitative' as const,
    title: 'Wet days in the growing season (days per year)',
    scale: { domain: [0, wetMax], nice: false },
  };
  const y = {
    field: 'load',
    type: 'quantitative' as const,
    title: `Nitrate-N load (${du.load.label} per year)`,
    scale: { domain: [0, loadMax], nice: false },
  };
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: {
      text: 'Nitrate-N load against field wetness',
      subtitle: `${data.fieldName}: mean annual values, ${data.period.years} years`,
    },
    width: TRADEOFF_SIZE.width,
    height: TRADEOFF_SIZE.height,
    config: CONFIG,
    data: { values },
    layer: [
      {
        mark: { type: 'point', size: 140, filled: true, opacity: 1 },
        encoding: { x, y, color: scenarioColour(names, false) },
      },
      {
        mark: { type: 'text', align: 'center', baseline: 'middle', fontSize: LABEL_FONT },
        encoding: {
          x: { ...x, field: 'labelWet' },
          y: { ...y, field: 'labelLoad' },
          text: { field: 'label' },
          color: scenarioColour(names, false),
        },
      },
    ],
  };
}
/** Plot size of the trade-off chart, px. */
const TRADEOFF_SIZE = { width: 520, height: 320 };
const LABEL_FONT = 12;
/** The smallest of 1, 2, 2.5, 5 x 10^k at or above x (a round axis end). */
export function niceCeil(x: number): number {
  const p = 10 ** Math.floor(Math.log10(x));
  for (const m of [1, 2, 2.5, 5, 10]) if (m * p >= x * (1 - 1e-12)) return m * p;
  return 10 * p;
}
/** A label's box in plot pixels (y downward). */
interface Box {
  x0: number;
  x1: number;
  y0: number;
  y1: number;
}
const overlaps = (a: Box, b: Box) => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;
/**
 * Put each point's label where it overlaps no other label and no point: to the right, left,
 * above or below the point, the first that is free (right if none is). Label widths are
 * estimated at 0.62 em per character (DejaVu Sans averages about 0.6, from memory). Returns
 * the points with the label's centre in data units (labelWet, labelLoad).
 */
export function placeLabels<P extends { label: string; wet: number; load: number }>(
  points: readonly P[],
  wetMax: number,
  loadMax: number,
): Array<P & { labelWet: number; labelLoad: number }> {
  const { width, height } = TRADEOFF_SIZE;
  const px = (p: P) => ({ x: (p.wet / wetMax) * width, y: height - (p.load / loadMax) * height });
  const R = 7; // point radius, px (size 140 -> about 6.7 px)
  const pointBoxes = points.map((p) => {
    const c = px(p);
    return { x0: c.x - R, x1: c.x + R, y0: c.y - R, y1: c.y + R };
  });
  const placed: Box[] = [];
  return points.map((p) => {
    const c = px(p);
    const w = 0.62 * LABEL_FONT * p.label.length;
    const h = LABEL_FONT + 2;
    const gap = R + 4;
    const candidates = [
      { cx: c.x + gap + w / 2, cy: c.y },
      { cx: c.x - gap - w / 2, cy: c.y },
      { cx: c.x, cy: c.y - gap - h / 2 },
      { cx: c.x, cy: c.y + gap + h / 2 },
      { cx: c.x + gap + w / 2, cy: c.y - h },
      { cx: c.x + gap + w / 2, cy: c.y + h },
    ];
    const boxOf = (k: (typeof candidates)[number]): Box => ({
      x0: k.cx - w / 2,
      x1: k.cx + w / 2,
      y0: k.cy - h / 2,
      y1: k.cy + h / 2,
    });
    const free = candidates.find((k) => {
      const b = boxOf(k);
      return (
        b.x0 >= 0 &&
        b.x1 <= width &&
        b.y0 >= 0 &&
        b.y1 <= height &&
        !placed.some((o) => overlaps(b, o)) &&
        !pointBoxes.some((o) => overlaps(b, o))
      );
    });
    const best = free ?? candidates[0];
    placed.push(boxOf(best));
    return {
      ...p,
      labelWet: roundTo((best.cx / width) * wetMax, 4),
      labelLoad: roundTo(((height - best.cy) / height) * loadMax, 4),
    };
  });
}
