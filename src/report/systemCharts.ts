/**
 * Vega-Lite profile charts of a drain-system design, one per main: the ground line, the pipe
 * invert, and the band between the shallowest invert the minimum cover allows and the deepest
 * the machine digs, with flagged stations marked. Pure: design in, plain JSON specs out.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { SystemDesign, SystemSettings } from '../drainage/systemDesign.js';
import type { UnitSystem } from '../units/quantity.js';
import { TilefluxError } from '../errors.js';
import { CONFIG, PALETTE, VEGA_LITE_SCHEMA } from './chartTheme.js';
import { displayUnits } from './units.js';

const GROUND_COLOUR = '#7a5230';
const FLAG_COLOUR = '#8c1c13';
const BAND_COLOUR = '#dfe9ef';

/** File stem of a main's profile chart: "profile-" and the main's name in safe characters. */
export function profileChartName(main: string): string {
  const stem = main
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
  return `profile-${stem || 'main'}`;
}

/**
 * One profile chart per main that has profile points, keyed by chart name (file stem), with a
 * caption for each.
 *
 * @example Object.keys(profileChartSpecs(design, settings, 'si', 'Plan').specs) // ['profile-trunk', ...]
 */
export function profileChartSpecs(
  design: SystemDesign,
  settings: Pick<SystemSettings, 'minimumCoverM' | 'maximumDepthM'>,
  units: UnitSystem,
  planName: string,
): { specs: Record<string, TopLevelSpec>; captions: Record<string, string> } {
  const du = displayUnits(units).length;
  const r = (x: number) => Math.round(x * du.factor * 1000) / 1000;
  const out: Record<string, TopLevelSpec> = {};
  const captions: Record<string, string> = {};
  for (const m of design.mains) {
    const points = design.profile.filter((p) => p.main === m.name);
    if (points.length === 0) continue;
    const diameter = new Map(design.reaches.map((d) => [d.reach.id, d.selected.diameterM]));
    const values = points.map((p) => ({
      station: r(p.stationM),
      ground: r(p.groundM),
      invert: r(p.invertM),
      shallowest: r(p.groundM - settings.minimumCoverM - (diameter.get(p.reachId) ?? 0)),
      deepest: r(p.groundM - settings.maximumDepthM),
      cut: r(p.cutM),
      reach: p.reachId,
      flag: p.flag,
    }));
    const x = {
      field: 'station',
      type: 'quantitative' as const,
      title: `Station from the downstream end (${du.label})`,
      scale: { domain: [0, r(m.lengthM)], nice: false },
    };
    const y = (field: string) => ({
      field,
      type: 'quantitative' as const,
      title: `Elevation (${du.label})`,
      scale: { zero: false },
    });
    const deepest =
      m.maxCutM === undefined
        ? ''
        : `; deepest cut ${(m.maxCutM * du.factor).toFixed(2)} ${du.label} at station ` +
          `${((m.maxCutStationM ?? 0) * du.factor).toFixed(0)} ${du.label}`;
    const name = profileChartName(m.name);
    if (name in out) {
      throw new TilefluxError(
        `mains ${m.name} and another give the same chart name ${name}; rename one`,
      );
    }
    captions[name] =
      `Profile of main ${m.name}: ground line, pipe invert and the band between the minimum ` +
      'cover and the maximum depth; triangles mark stations outside it.';
    out[name] = {
      $schema: VEGA_LITE_SCHEMA,
      title: {
        text: `Profile of main ${m.name}`,
        subtitle: [
          `${planName}: ground (brown) and pipe invert (blue)`,
          `shaded: between the minimum cover and the maximum depth${deepest}`,
        ],
      },
      width: 640,
      height: 280,
      config: CONFIG,
      data: { values },
      layer: [
        {
          mark: { type: 'area', color: BAND_COLOUR, opacity: 1 },
          encoding: { x, y: y('deepest'), y2: { field: 'shallowest' } },
        },
        {
          mark: { type: 'line', color: GROUND_COLOUR },
          encoding: { x, y: y('ground'), tooltip: [{ field: 'station' }, { field: 'ground' }] },
        },
        {
          mark: { type: 'line', color: PALETTE[0], point: true },
          encoding: {
            x,
            y: y('invert'),
            tooltip: [
              { field: 'station' },
              { field: 'invert' },
              { field: 'cut' },
              { field: 'reach' },
            ],
          },
        },
        {
          transform: [{ filter: "datum.flag != ''" }],
          mark: {
            type: 'point',
            shape: 'triangle-down',
            size: 90,
            color: FLAG_COLOUR,
            filled: true,
          },
          encoding: { x, y: y('invert'), tooltip: [{ field: 'station' }, { field: 'flag' }] },
        },
      ],
    };
  }
  return { specs: out, captions };
}
