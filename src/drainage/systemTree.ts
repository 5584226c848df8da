/**
 * The drain system as a tree: mains made of reaches, laterals and further areas draining into
 * reaches, tributary mains discharging into a reach boundary of another main, one main at the
 * outlet. Built from a validated system file, checked (names, junctions, cycles) and then
 * accumulated: each reach carries the drained area and the surface-inlet flow of everything
 * above its lower end.
 *
 * Method: the design flow of a reach is taken at its downstream end, so a reach is sized for
 * all the laterals along it and everything upstream (common practice: a main is sized section
 * by section for the area above the lower end of each section). Stations run along each main
 * from its downstream end; reaches are listed from the downstream end upward.
 */
import { TilefluxError } from '../errors.js';
import type { PipeMaterialName } from './pipeMaterials.js';
import type { SystemFile } from './systemSchema.js';

/** A group of identical parallel laterals draining into one reach. */
export interface LateralGroup {
  /** "main-2/L1": reach id and the group's number along the reach. */
  id: string;
  reachId: string;
  /** Where the group is given in the file, for messages ("mains[0].reaches[1].laterals[0]"). */
  key: string;
  count: number;
  lengthM: number;
  spacingM: number;
  /** Fixed grade, m/m. */
  grade: number;
  material: PipeMaterialName;
  side?: 'left' | 'right' | 'both';
  /** Area drained by one lateral, m2 (length x spacing). */
  areaEachM2: number;
}

/** One reach of a main, with what drains into it and, after accumulation, what it carries. */
export interface Reach {
  /** "main-1" for the first (most downstream) reach of main "main". */
  id: string;
  main: string;
  /** 0-based position along the main, from the downstream end. */
  index: number;
  key: string;
  fromStationM: number;
  toStationM: number;
  lengthM: number;
  /** Grade fixed in the file, m/m, or undefined to lay it from the profile. */
  fixedGrade?: number;
  material: PipeMaterialName;
  laterals: LateralGroup[];
  /** Area draining directly into this reach (its laterals plus any `area`), m2. */
  localAreaM2: number;
  /** Surface-inlet flow entering this reach, m3/s. */
  localInletM3s: number;
  /** Area above the reach's lower end, m2 (set by `accumulate`). */
  areaAboveM2: number;
  /** Surface-inlet flow above the reach's lower end, m3/s (set by `accumulate`). */
  inletAboveM3s: number;
}

/** A main: its reaches and where it discharges. */
export interface Main {
  name: string;
  key: string;
  joins?: { main: string; stationM: number };
  reaches: Reach[];
  lengthM: number;
}

/** The checked tree, mains in design order: the outlet main first, every main after its receiver. */
export interface SystemTree {
  mains: Main[];
  outletMain: string;
}

/** Stations closer than this (m) are the same point. */
const STATION_TOLERANCE_M = 1e-6;

/** A problem at a key of the file; the reader of the file turns the key into a line. */
function fail(key: string, message: string): never {
  throw new TilefluxError(message, key);
}

/**
 * Build and check the tree of a validated system file, and accumulate areas and inlet flows.
 *
 * @example buildSystemTree(systemSchema.parse(yamlObject)).mains[0].reaches[0].areaAboveM2
 */
export function buildSystemTree(file: SystemFile): SystemTree {
  const names = new Map<string, number>();
  file.mains.forEach((m, i) => {
    if (names.has(m.name)) fail(`mains[${i}].name`, `main "${m.name}" is named twice`);
    names.set(m.name, i);
  });
  const mains: Main[] = file.mains.map((m, i) => {
    const key = `mains[${i}]`;
    let station = 0;
    const reaches = m.reaches.map((r, j): Reach => {
      const rkey = `${key}.reaches[${j}]`;
      const id = `${m.name}-${j + 1}`;
      const material = r.material ?? m.material ?? file.material;
      const laterals = (r.laterals ?? []).map((g, k): LateralGroup => {
        const gkey = `${rkey}.laterals[${k}]`;
        const spacingM = g.spacing ?? file.laterals.spacing;
        if (spacingM === undefined) {
          fail(`${gkey}.spacing`, 'give the lateral spacing here or as laterals.spacing');
        }
        const grade = g.grade ?? file.laterals.grade;
        if (grade === undefined) {
          fail(`${gkey}.grade`, 'give the laterals a grade here or as laterals.grade');
        }
        return {
          id: `${id}/L${k + 1}`,
          reachId: id,
          key: gkey,
          count: g.count,
          lengthM: g.length,
          spacingM,
          grade,
          material: g.material ?? file.laterals.material ?? material,
          ...(g.side && { side: g.side }),
          areaEachM2: g.length * spacingM,
        };
      });
      const localAreaM2 =
        laterals.reduce((s, g) => s + g.count * g.areaEachM2, 0) + (r.area ?? 0) * 10000;
      const fixedGrade = r.grade ?? m.grade;
      const reach: Reach = {
        id,
        main: m.name,
        index: j,
        key: rkey,
        fromStationM: station,
        toStationM: station + r.length,
        lengthM: r.length,
        ...(fixedGrade !== undefined && { fixedGrade }),
        material,
        laterals,
        localAreaM2,
        localInletM3s: r.inletFlow ?? 0,
        areaAboveM2: 0,
        inletAboveM3s: 0,
      };
      station += r.length;
      return reach;
    });
    return {
      name: m.name,
      key,
      ...(m.joins && { joins: { main: m.joins.main, stationM: m.joins.station } }),
      reaches,
      lengthM: station,
    };
  });

  const outlets = mains.filter((m) => m.joins === undefined);
  if (outlets.length !== 1) {
    fail(
      'mains',
      outlets.length === 0
        ? 'every main joins another; exactly one main (without joins) must reach the outlet'
        : `exactly one main reaches the outlet (has no joins); got ${outlets.map((m) => m.name).join(', ')}`,
    );
  }
  const byName = new Map(mains.map((m) => [m.name, m]));
  for (const m of mains) {
    if (!m.joins) continue;
    const into = byName.get(m.joins.main);
    if (!into) {
      fail(
        `${m.key}.joins.main`,
        `no main is named "${m.joins.main}"; mains are ${[...byName.keys()].join(', ')}`,
      );
    }
    if (into === m) fail(`${m.key}.joins.main`, `main "${m.name}" cannot join itself`);
    const s = m.joins.stationM;
    const boundary = into.reaches.find((r) => Math.abs(r.toStationM - s) <= STATION_TOLERANCE_M);
    if (!boundary) {
      fail(
        `${m.key}.joins.station`,
        `a main joins another at the upper end of one of its reaches; stations of ` +
          `"${into.name}" are ${into.reaches.map((r) => +r.toStationM.toFixed(3)).join(', ')} m; got ${+s.toFixed(3)} m`,
      );
    }
  }

  // Design order: receivers before tributaries (breadth-first from the outlet); a main never
  // reached belongs to a cycle.
  const order: Main[] = [outlets[0]];
  for (let i = 0; i < order.length; i++) {
    for (const m of mains) if (m.joins?.main === order[i].name) order.push(m);
  }
  if (order.length !== mains.length) {
    const lost = mains.filter((m) => !order.includes(m)).map((m) => m.name);
    fail('mains', `mains ${lost.join(', ')} join in a loop and never reach the outlet`);
  }
  accumulate(order);
  return { mains: order, outletMain: outlets[0].name };
}

/**
 * Accumulate areas and inlet flows from the top of the tree down: a reach carries its own
 * laterals, area and inlets, the reach above it on the same main, and every main that joins at
 * its upper end. `mains` must be in design order (receivers first).
 */
function accumulate(mains: readonly Main[]): void {
  for (let i = mains.length - 1; i >= 0; i--) {
    const m = mains[i];
    let area = 0;
    let inlet = 0;
    for (let j = m.reaches.length - 1; j >= 0; j--) {
      const r = m.reaches[j];
      area += r.localAreaM2;
      inlet += r.localInletM3s;
      for (const t of mains) {
        if (t.joins?.main !== m.name) continue;
        if (Math.abs(t.joins.stationM - r.toStationM) > STATION_TOLERANCE_M) continue;
        area += t.reaches[0].areaAboveM2;
        inlet += t.reaches[0].inletAboveM3s;
      }
      r.areaAboveM2 = area;
      r.inletAboveM3s = inlet;
    }
  }
}
