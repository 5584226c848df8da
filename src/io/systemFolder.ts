/**
 * The tables of a drain-system design (reaches.csv, laterals.csv, profile.csv) and its JSON
 * summary. Rows are built once, in SI with the unit in each column name, and converted to US
 * customary units by the column suffixes (`io/tables.ts`) when asked.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { SizedPipe, SystemDesign, SystemSettings } from '../drainage/systemDesign.js';
import type { UnitSystem } from '../units/quantity.js';
import { recordIn, toCsv } from './tables.js';

type Row = Record<string, string | number>;

/** Columns shared by reaches and laterals: the sized pipe. */
function pipeColumns(p: SizedPipe): Row {
  return {
    material: p.material,
    roughness_n: p.roughness,
    design_flow_l_s: p.designFlowM3s * 1000,
    required_diameter_mm: p.requiredDiameterM * 1000,
    selected_size: `${p.selected.nominal} ${p.selected.unit}`,
    selected_diameter_mm: p.selected.diameterM * 1000,
    capacity_l_s: p.capacityM3s * 1000,
    capacity_used_percent: p.sharePercent,
    full_flow_velocity_m_s: p.velocityMs,
    grade_percent: p.grade * 100,
    grade_set_by: p.gradeLimit,
    min_grade_percent: p.minimumGrade * 100,
    meets_min_grade: p.grade >= p.minimumGrade * (1 - 1e-9) ? 'yes' : 'no',
    effective_coefficient_mm_d: p.effectiveCoefficientMmD,
  };
}

/**
 * One row per reach, downstream first within each main, mains in design order.
 *
 * @example reachRows(design)[0].drained_area_ha // the whole system's area at the outlet
 */
export function reachRows(design: SystemDesign): Row[] {
  return design.reaches.map((d) => ({
    reach: d.reach.id,
    main: d.reach.main,
    from_station_m: d.reach.fromStationM,
    to_station_m: d.reach.toStationM,
    length_m: d.reach.lengthM,
    drained_area_ha: d.reach.areaAboveM2 / 10000,
    inlet_flow_l_s: d.reach.inletAboveM3s * 1000,
    ...pipeColumns(d),
    invert_from_m: d.invertFromM,
    invert_to_m: d.invertToM,
    max_cut_m: d.maxCutM ?? NaN,
    max_cut_station_m: d.maxCutStationM ?? NaN,
    min_cover_m: d.minCoverM ?? NaN,
    trench_flag: [
      d.shallowStations ? `shallow at ${d.shallowStations}` : '',
      d.deepStations ? `deep at ${d.deepStations}` : '',
    ]
      .filter((x) => x)
      .join(', '),
  }));
}

/** One row per lateral group (each lateral of a group is the same). */
export function lateralRows(design: SystemDesign): Row[] {
  return design.laterals.map((l) => ({
    laterals: l.id,
    reach: l.reachId,
    count: l.count,
    length_m: l.lengthM,
    spacing_m: l.spacingM,
    drained_area_each_ha: l.areaEachM2 / 10000,
    ...pipeColumns(l),
    path_coefficient_mm_d: l.pathCoefficientMmD,
  }));
}

/** One row per profile station of every main. */
export function profileRows(design: SystemDesign): Row[] {
  return design.profile.map((p) => ({
    main: p.main,
    reach: p.reachId,
    station_m: p.stationM,
    ground_elevation_m: p.groundM,
    invert_elevation_m: p.invertM,
    cut_m: p.cutM,
    cover_m: p.coverM,
    flag: p.flag,
  }));
}

/** The design's JSON summary (what `--json` prints), in the chosen units. */
export function systemSummary(
  name: string,
  design: SystemDesign,
  settings: SystemSettings,
  units: UnitSystem,
  written: string[],
): Record<string, unknown> {
  return {
    name,
    method: 'drainage-coefficient flows, Manning full-pipe sizes, uniform grades per reach',
    units,
    settings: recordIn(
      {
        coefficient_mm_d: settings.coefficientMmD,
        size_list: `${settings.sizes.nominal.join(',')} ${settings.sizes.unit}`,
        velocity_m_s: settings.velocityMs,
        round: settings.round,
        depth_m: settings.depthM,
        minimum_cover_m: settings.minimumCoverM,
        maximum_depth_m: settings.maximumDepthM,
      },
      units,
    ),
    inverts: design.invertsAbsolute ? 'elevations' : 'relative to the outlet invert',
    ...recordIn(
      {
        lateral_coefficient_mm_d: design.lateralCoefficientMmD,
        field_coefficient_mm_d: design.fieldCoefficientMmD,
      },
      units,
    ),
    mains: design.mains.map((m) =>
      recordIn(
        {
          main: m.name,
          length_m: m.lengthM,
          max_cut_m: m.maxCutM ?? null,
          max_cut_station_m: m.maxCutStationM ?? null,
          shallow_stations: m.shallowStations,
          deep_stations: m.deepStations,
        },
        units,
      ),
    ),
    reaches: reachRows(design).map((r) => recordIn(r, units)),
    laterals: lateralRows(design).map((r) => recordIn(r, units)),
    notes: design.notes,
    files: written,
  };
}

/** Write reaches.csv, laterals.csv and (with a profile) profile.csv; returns the names written. */
export function writeSystemTables(dir: string, design: SystemDesign, units: UnitSystem): string[] {
  const files: Array<[string, Row[]]> = [
    ['reaches.csv', reachRows(design)],
    ['laterals.csv', lateralRows(design)],
    ['profile.csv', profileRows(design)],
  ];
  const written: string[] = [];
  for (const [name, rows] of files) {
    if (rows.length === 0) continue;
    writeFileSync(join(dir, name), toCsv(rows, units));
    written.push(name);
  }
  return written;
}
