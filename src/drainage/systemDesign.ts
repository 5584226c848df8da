/**
 * Design of a whole drain system: every reach of every main and every lateral group sized for
 * the flow above its lower end, grades fixed or laid on the ground profile from the outlet
 * upward, the depth of cut along each main, and the drainage coefficient each selected size
 * really delivers.
 *
 * Method:
 * - design flow = drained area above the lower end x drainage coefficient + surface-inlet flow
 *   (the drainage-coefficient method of drain design; common practice);
 * - required diameter by Manning's equation for a full circular pipe at the reach's grade
 *   (Chow 1959), with n by material and size (`pipeMaterials.ts`);
 * - the selected size is the next commercial size up (common practice) or, with `round: down`,
 *   the next size down, which delivers less than the chosen coefficient;
 * - grades: a fixed grade where the file gives one, else laid on the profile (`gradeLaying.ts`),
 *   never flatter than the minimum grade of the size being tried. Size and grade depend on each
 *   other (a larger pipe has a flatter minimum grade and more cover to find), so each size of the
 *   list is tried in turn, smallest first, with its own laid grade;
 * - effective coefficient = (capacity at the selected size and grade - inlet flow above) / area
 *   above: what the plan removes from the drained area when the pipe flows full. Larger than the
 *   chosen coefficient when rounding up (spare capacity for later inlets or sediment), smaller
 *   when rounding down.
 * Tributary mains start at the invert of the main they join, at the junction station.
 *
 * Longer than most files: sizing and grade laying depend on each other reach by reach (each size
 * is tried with its own laid grade), so `designSystem` walks the mains and their laterals in one
 * pass; the grade laying, Manning and the size lists are in their own modules.
 */
import { SettingError, TilefluxError } from '../errors.js';
import {
  layReach,
  groundAt,
  reachStations,
  type GradeLimit,
  type GroundProfile,
} from './gradeLaying.js';
import { fullFlowVelocity, manningDiameter, manningFullCapacity } from './manning.js';
import { materialMinimumGrade, roughnessFor, type PipeMaterialName } from './pipeMaterials.js';
import {
  pipeDiameterM,
  selectPipeSize,
  type PipeSizeList,
  type SelectedPipe,
} from './pipeSizes.js';
import type { Main, Reach, SystemTree } from './systemTree.js';

/** Settings of a system design, SI units. */
export interface SystemSettings {
  /** Drainage coefficient, mm/d. */
  coefficientMmD: number;
  sizes: PipeSizeList;
  /** Full-flow velocity target of the minimum grade, m/s. */
  velocityMs: number;
  round: 'up' | 'down';
  /** Invert elevation at the outlet, m, if given. */
  outletInvertM?: number;
  /** Depth of the outlet invert below the ground at station 0 of the outlet main, m. */
  outletDepthM?: number;
  /** Design depth of cut to the invert, m. */
  depthM: number;
  minimumCoverM: number;
  maximumDepthM: number;
}

/** One sized pipe: a reach of a main or a lateral of a group. */
export interface SizedPipe {
  material: PipeMaterialName;
  roughness: number;
  designFlowM3s: number;
  requiredDiameterM: number;
  selected: SelectedPipe;
  capacityM3s: number;
  /** Design flow / capacity, percent. */
  sharePercent: number;
  velocityMs: number;
  grade: number;
  minimumGrade: number;
  /** What set the grade. */
  gradeLimit: GradeLimit;
  /** Drainage coefficient the selected size delivers over its drained area, mm/d (NaN: no area). */
  effectiveCoefficientMmD: number;
}

export interface ReachDesign extends SizedPipe {
  reach: Reach;
  /** Invert elevations at the lower and upper end, m. */
  invertFromM: number;
  invertToM: number;
  /** Deepest cut and shallowest cover along the reach (with a profile), m. */
  maxCutM?: number;
  maxCutStationM?: number;
  minCoverM?: number;
  /** Profile stations of the reach with less than the minimum cover, or deeper than the maximum. */
  shallowStations: number;
  deepStations: number;
}

export interface LateralDesign extends SizedPipe {
  id: string;
  reachId: string;
  count: number;
  lengthM: number;
  spacingM: number;
  areaEachM2: number;
  /**
   * Smallest effective coefficient on the way to the outlet, mm/d: this lateral's, and that of
   * every reach its water passes through (a main sized for less limits the laterals above it).
   */
  pathCoefficientMmD: number;
}

/** One station of a main's profile. */
export interface ProfilePoint {
  main: string;
  reachId: string;
  stationM: number;
  groundM: number;
  invertM: number;
  cutM: number;
  coverM: number;
  flag: '' | 'shallow' | 'deep';
}

export interface MainSummary {
  name: string;
  lengthM: number;
  maxCutM?: number;
  maxCutStationM?: number;
  shallowStations: number;
  deepStations: number;
}

export interface SystemDesign {
  reaches: ReachDesign[];
  laterals: LateralDesign[];
  profile: ProfilePoint[];
  mains: MainSummary[];
  /** Whether the inverts are elevations (outlet invert or profile given) or relative to the outlet. */
  invertsAbsolute: boolean;
  /** Smallest effective coefficient of the lateral groups alone, mm/d. */
  lateralCoefficientMmD: number;
  /**
   * Smallest path coefficient of the lateral groups, mm/d: what the plan's drains carry from
   * every part of the field to the outlet, and what a field file's `drains.system` feeds into
   * `drains.capacity`.
   */
  fieldCoefficientMmD: number;
  /** Plain sentences for the reader: grades below minimum, cover and depth flags, rounding. */
  notes: string[];
}

const MM_D_PER_M_S = 1000 * 86400;
const SAME = 1 - 1e-12;

/** Required diameter (m) for a flow on a grade; zero flow needs no pipe. */
function requiredDiameter(flowM3s: number, grade: number, n: number): number {
  return flowM3s > 0 ? manningDiameter(flowM3s, grade, n) : 0;
}

/**
 * Size one pipe: try each size of the list with the grade it would be laid at, and keep the
 * first that is large enough (round up) or the last that is not larger than needed (round down).
 */
function sizePipe(
  flowM3s: number,
  areaM2: number,
  inletM3s: number,
  material: PipeMaterialName,
  s: SystemSettings,
  gradeFor: (diameterM: number, minimumGrade: number) => { grade: number; limit: GradeLimit },
  where: string,
): SizedPipe {
  const tries = s.sizes.nominal.map((nominal) => {
    const diameterM = pipeDiameterM(nominal, s.sizes.unit);
    const n = roughnessFor(material, diameterM);
    const minimumGrade = materialMinimumGrade(material, diameterM, s.velocityMs);
    const laid = gradeFor(diameterM, minimumGrade);
    const required = requiredDiameter(flowM3s, laid.grade, n);
    return { nominal, diameterM, n, minimumGrade, laid, required };
  });
  let pick = -1;
  if (s.round === 'up') pick = tries.findIndex((t) => t.diameterM >= t.required * SAME);
  else {
    for (let i = 0; i < tries.length; i++)
      if (tries[i].diameterM <= tries[i].required / SAME) pick = i;
    if (pick < 0) pick = 0;
  }
  if (pick < 0) {
    const last = tries[tries.length - 1];
    // The standard message of a requirement beyond the list.
    selectPipeSize(last.required, s.sizes, `the sizes of ${where}`);
  }
  const t = tries[pick];
  const capacityM3s = manningFullCapacity(t.diameterM, t.laid.grade, t.n);
  return {
    material,
    roughness: t.n,
    designFlowM3s: flowM3s,
    requiredDiameterM: t.required,
    selected: { nominal: t.nominal, unit: s.sizes.unit, diameterM: t.diameterM },
    capacityM3s,
    sharePercent: (100 * flowM3s) / capacityM3s,
    velocityMs: fullFlowVelocity(t.diameterM, t.laid.grade, t.n),
    grade: t.laid.grade,
    minimumGrade: t.minimumGrade,
    gradeLimit: t.laid.limit,
    effectiveCoefficientMmD: areaM2 > 0 ? ((capacityM3s - inletM3s) / areaM2) * MM_D_PER_M_S : NaN,
  };
}

function flowOf(areaM2: number, inletM3s: number, s: SystemSettings): number {
  return (areaM2 * s.coefficientMmD) / MM_D_PER_M_S + inletM3s;
}

/**
 * Design a checked system tree, with or without ground profiles (one per main, by name).
 *
 * @example designSystem(buildSystemTree(file), settings, profiles).reaches[0].selected.nominal // 8
 */
export function designSystem(
  tree: SystemTree,
  s: SystemSettings,
  profiles?: ReadonlyMap<string, GroundProfile>,
): SystemDesign {
  if (profiles) {
    for (const m of tree.mains) {
      if (!profiles.has(m.name)) {
        throw new TilefluxError(
          `the profile has no stations for main "${m.name}"; give main,station,elevation rows for every main`,
        );
      }
    }
    const known = new Set(tree.mains.map((m) => m.name));
    for (const name of profiles.keys()) {
      if (!known.has(name)) {
        throw new TilefluxError(
          `the profile names main "${name}", which the system does not have; mains are ${[...known].join(', ')}`,
        );
      }
    }
  } else if (s.outletDepthM !== undefined) {
    throw new SettingError(
      (n) =>
        `outlet.depth is a depth below the ground and needs a profile (${n('profile')}); give outlet.invert instead`,
    );
  }
  const outletMain = tree.mains[0];
  const outletInvert =
    s.outletInvertM ??
    (profiles
      ? groundAt(profiles.get(outletMain.name)!, 0, outletMain.name) - (s.outletDepthM ?? s.depthM)
      : 0);

  const reaches: ReachDesign[] = [];
  const laterals: LateralDesign[] = [];
  const profile: ProfilePoint[] = [];
  const mains: MainSummary[] = [];
  const notes: string[] = [];
  const invertAt = new Map<string, (stationM: number) => number>();

  for (const m of tree.mains) {
    const ground = profiles?.get(m.name);
    let z = m.joins ? invertAt.get(m.joins.main)!(m.joins.stationM) : outletInvert;
    const designs: ReachDesign[] = [];
    for (const r of m.reaches) {
      const z0 = z;
      const where = `reach ${r.id} (${r.key})`;
      let gradeFor: (d: number, gmin: number) => { grade: number; limit: GradeLimit };
      if (r.fixedGrade !== undefined) {
        const g = r.fixedGrade;
        gradeFor = () => ({ grade: g, limit: 'fixed' });
      } else if (ground) {
        gradeFor = (diameterM, minimumGrade) =>
          layReach({
            invertStartM: z0,
            fromStationM: r.fromStationM,
            toStationM: r.toStationM,
            profile: ground,
            main: m.name,
            minimumGrade,
            diameterM,
            depthM: s.depthM,
            minimumCoverM: s.minimumCoverM,
            maximumDepthM: s.maximumDepthM,
          });
      } else {
        throw new SettingError(
          (n) =>
            `${r.key}.grade: reach ${r.id} has no grade; give it a grade (or the main one), or give a ground profile with ${n('profile')}`,
        );
      }
      const sized = sizePipe(
        flowOf(r.areaAboveM2, r.inletAboveM3s, s),
        r.areaAboveM2,
        r.inletAboveM3s,
        r.material,
        s,
        gradeFor,
        where,
      );
      z = z0 + sized.grade * r.lengthM;
      designs.push({
        ...sized,
        reach: r,
        invertFromM: z0,
        invertToM: z,
        shallowStations: 0,
        deepStations: 0,
      });
      if (sized.gradeLimit === 'fixed' && sized.grade < sized.minimumGrade) {
        notes.push(
          `Reach ${r.id}: the fixed grade ${(sized.grade * 100).toFixed(3)} % is flatter than the ` +
            `minimum ${(sized.minimumGrade * 100).toFixed(3)} % for ${r.material} at this size; ` +
            'sediment may settle where the soil holds fine sand or silt.',
        );
      }
      for (const g of r.laterals) {
        const area = g.areaEachM2;
        const lat = sizePipe(
          flowOf(area, 0, s),
          area,
          0,
          g.material,
          s,
          () => ({ grade: g.grade, limit: 'fixed' }),
          `lateral group ${g.id} (${g.key})`,
        );
        laterals.push({
          ...lat,
          id: g.id,
          reachId: g.reachId,
          count: g.count,
          lengthM: g.lengthM,
          spacingM: g.spacingM,
          areaEachM2: area,
          pathCoefficientMmD: NaN,
        });
      }
    }
    const invert = (stationM: number): number => {
      const d =
        designs.find((x) => stationM <= x.reach.toStationM + 1e-6) ?? designs[designs.length - 1];
      return d.invertFromM + d.grade * (stationM - d.reach.fromStationM);
    };
    invertAt.set(m.name, invert);
    const summary: MainSummary = {
      name: m.name,
      lengthM: m.lengthM,
      shallowStations: 0,
      deepStations: 0,
    };
    if (ground) profileOf(m, designs, ground, s, profile, summary);
    mains.push(summary);
    reaches.push(...designs);
  }

  const flat = laterals.filter((l) => l.grade < l.minimumGrade);
  if (flat.length > 0) {
    const pct = (x: number) => `${(x * 100).toFixed(3)} %`;
    const pairs = new Set(flat.map((l) => `${pct(l.grade)} < ${pct(l.minimumGrade)}`));
    notes.push(
      `Laterals ${flat.map((l) => l.id).join(', ')}: grades flatter than the minimum for their ` +
        `size (${[...pairs].join('; ')}); sediment may settle where the soil holds fine sand or silt.`,
    );
  }
  for (const m of tree.mains) {
    const d = reaches.filter((r) => r.reach.main === m.name);
    for (let i = 0; i + 1 < d.length; i++) {
      if (d[i].selected.diameterM < d[i + 1].selected.diameterM) {
        notes.push(
          `Reach ${d[i].reach.id} (${d[i].selected.nominal} ${d[i].selected.unit}) is smaller than ` +
            `${d[i + 1].reach.id} above it (${d[i + 1].selected.nominal} ${d[i + 1].selected.unit}), ` +
            'carried by its steeper grade; many guides never let a main get smaller downstream.',
        );
      }
    }
  }
  for (const m of mains) {
    if (m.shallowStations > 0) {
      notes.push(
        `Main ${m.name}: ${m.shallowStations} station(s) with less than the minimum cover ` +
          `(${s.minimumCoverM} m over the pipe); see profile.csv (flag shallow).`,
      );
    }
    if (m.deepStations > 0) {
      notes.push(
        `Main ${m.name}: ${m.deepStations} station(s) deeper than the maximum depth ` +
          `(${s.maximumDepthM} m to the invert); see profile.csv (flag deep).`,
      );
    }
  }
  if (s.round === 'down') {
    const pipes: Array<[string, SizedPipe]> = [
      ...reaches.map((r): [string, SizedPipe] => [r.reach.id, r]),
      ...laterals.map((l): [string, SizedPipe] => [l.id, l]),
    ];
    const short = pipes.filter(([, p]) => p.effectiveCoefficientMmD < s.coefficientMmD * SAME);
    if (short.length > 0) {
      notes.push(
        `Rounding down: ${short.map(([id]) => id).join(', ')} deliver less than the chosen ` +
          `coefficient of ${s.coefficientMmD.toFixed(2)} mm/d (see effective_coefficient_mm_d).`,
      );
    }
  }
  const byId = new Map(reaches.map((r) => [r.reach.id, r]));
  const mainOf = new Map(tree.mains.map((m) => [m.name, m]));
  for (const l of laterals) {
    let least = l.effectiveCoefficientMmD;
    const start = byId.get(l.reachId)!.reach;
    let main = mainOf.get(start.main)!;
    let upToM = start.toStationM;
    for (;;) {
      for (const r of main.reaches) {
        if (r.toStationM > upToM + 1e-6) break;
        const c = byId.get(r.id)!.effectiveCoefficientMmD;
        if (c < least) least = c;
      }
      if (!main.joins) break;
      upToM = main.joins.stationM;
      main = mainOf.get(main.joins.main)!;
    }
    l.pathCoefficientMmD = least;
  }
  const least = (xs: number[]) => (xs.length ? Math.min(...xs) : NaN);
  const lateralCoefficientMmD = least(laterals.map((l) => l.effectiveCoefficientMmD));
  const fieldCoefficientMmD = least(laterals.map((l) => l.pathCoefficientMmD));
  return {
    reaches,
    laterals,
    profile,
    mains,
    invertsAbsolute: s.outletInvertM !== undefined || profiles !== undefined,
    lateralCoefficientMmD,
    fieldCoefficientMmD,
    notes,
  };
}

/** Profile points of one main (surveyed stations and reach ends) with cut, cover and flags. */
function profileOf(
  m: Main,
  designs: ReachDesign[],
  ground: GroundProfile,
  s: SystemSettings,
  out: ProfilePoint[],
  summary: MainSummary,
): void {
  const tol = 1e-9;
  const points: Array<[number, ReachDesign]> = [[0, designs[0]]];
  for (const d of designs) {
    for (const st of reachStations(ground, d.reach.fromStationM, d.reach.toStationM))
      points.push([st, d]);
  }
  for (const [stationM, d] of points) {
    const groundM = groundAt(ground, stationM, m.name);
    const invertM = d.invertFromM + d.grade * (stationM - d.reach.fromStationM);
    const cutM = groundM - invertM;
    const coverM = cutM - d.selected.diameterM;
    const flag =
      coverM < s.minimumCoverM - tol ? 'shallow' : cutM > s.maximumDepthM + tol ? 'deep' : '';
    if (flag === 'shallow') {
      summary.shallowStations++;
      d.shallowStations++;
    }
    if (flag === 'deep') {
      summary.deepStations++;
      d.deepStations++;
    }
    out.push({ main: m.name, reachId: d.reach.id, stationM, groundM, invertM, cutM, coverM, flag });
    if (summary.maxCutM === undefined || cutM > summary.maxCutM) {
      summary.maxCutM = cutM;
      summary.maxCutStationM = stationM;
    }
    if (d.maxCutM === undefined || cutM > d.maxCutM) {
      d.maxCutM = cutM;
      d.maxCutStationM = stationM;
    }
    d.minCoverM = Math.min(d.minCoverM ?? Infinity, coverM);
  }
}
