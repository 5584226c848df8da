/**
 * Laying a reach of pipe on a ground profile: one uniform grade per reach, chosen from the
 * downstream invert upward, and the depth of cut that results along the reach.
 *
 * Method (common practice in laying drains from a survey): start at the known invert of the
 * reach's lower end and aim for the design depth of cut at its upper end (the grade that
 * follows the ground). That grade is then held inside the bounds the trench sets at every
 * surveyed station along the reach: never flatter than the minimum (flushing) grade of the
 * pipe, not so steep that the pipe comes up through the minimum cover, and not so flat that the
 * cut passes the deepest the machine digs. The minimum grade comes first; where the bounds
 * cannot all be met (a dip below the grade line, a knoll above it), the cover is kept before
 * the maximum depth and the stations that break a bound are flagged, for a person to decide
 * (a relief drain, a different route, a pump).
 *
 * With x the distance from the lower end, z0 its invert and G(s) the ground:
 *   aim      g* = (G(end) - depth - z0) / L
 *   cover    g <= (G(s) - z0 - (minimum cover + D)) / x   at every station
 *   machine  g >= (G(s) - z0 - maximum depth) / x          at every station
 *   flushing g >= minimum grade
 */
import { TilefluxError } from '../errors.js';

/** A surveyed ground line along one main: stations (m, increasing) and elevations (m). */
export interface GroundProfile {
  stationsM: Float64Array;
  elevationsM: Float64Array;
}

/**
 * Ground elevation (m) at a station by linear interpolation between surveyed stations.
 * A station outside the survey is an error naming the main.
 *
 * @example groundAt({ stationsM: Float64Array.of(0, 100), elevationsM: Float64Array.of(10, 11) }, 25, 'trunk') // 10.25
 */
export function groundAt(profile: GroundProfile, stationM: number, main: string): number {
  const s = profile.stationsM;
  const z = profile.elevationsM;
  const n = s.length;
  const tol = 1e-6;
  if (n === 0 || stationM < s[0] - tol || stationM > s[n - 1] + tol) {
    throw new TilefluxError(
      `the profile of main "${main}" covers stations ${n ? `${s[0]} to ${s[n - 1]}` : 'none'} m; ` +
        `the main needs station ${+stationM.toFixed(3)} m: survey the whole length of each main`,
    );
  }
  if (stationM <= s[0]) return z[0];
  let hi = 1;
  while (hi < n - 1 && s[hi] < stationM) hi++;
  if (stationM >= s[n - 1]) return z[n - 1];
  const t = (stationM - s[hi - 1]) / (s[hi] - s[hi - 1]);
  return z[hi - 1] + t * (z[hi] - z[hi - 1]);
}

/** What a reach's grade is held to. */
export type GradeLimit =
  'design depth' | 'minimum grade' | 'minimum cover' | 'maximum depth' | 'fixed';

export interface LayReachInput {
  /** Invert elevation at the lower end, m. */
  invertStartM: number;
  fromStationM: number;
  toStationM: number;
  profile: GroundProfile;
  main: string;
  /** Minimum grade of the pipe (m/m). */
  minimumGrade: number;
  /** Inside diameter, m (the cover bound is measured from the top of the pipe). */
  diameterM: number;
  depthM: number;
  minimumCoverM: number;
  maximumDepthM: number;
}

/** Stations (m) where a reach is checked: surveyed stations inside it and its upper end. */
export function reachStations(profile: GroundProfile, fromM: number, toM: number): number[] {
  const out: number[] = [];
  for (const s of profile.stationsM) if (s > fromM + 1e-6 && s < toM - 1e-6) out.push(s);
  out.push(toM);
  return out;
}

/**
 * The uniform grade (m/m) of one reach on the ground profile and the bound that set it.
 *
 * @example layReach({ invertStartM: 99, fromStationM: 0, toStationM: 100, profile, main: 'trunk',
 *   minimumGrade: 0.002, diameterM: 0.1524, depthM: 1, minimumCoverM: 0.6, maximumDepthM: 2.5 })
 * // { grade: 0.005, limit: 'design depth' } where the ground rises 0.5 m over the reach
 */
export function layReach(p: LayReachInput): { grade: number; limit: GradeLimit } {
  const lengthM = p.toStationM - p.fromStationM;
  const end = groundAt(p.profile, p.toStationM, p.main);
  const aim = (end - p.depthM - p.invertStartM) / lengthM;
  let coverHi = Infinity;
  let machineLo = -Infinity;
  for (const s of reachStations(p.profile, p.fromStationM, p.toStationM)) {
    const x = s - p.fromStationM;
    const g = groundAt(p.profile, s, p.main) - p.invertStartM;
    coverHi = Math.min(coverHi, (g - p.minimumCoverM - p.diameterM) / x);
    machineLo = Math.max(machineLo, (g - p.maximumDepthM) / x);
  }
  const lo = Math.max(p.minimumGrade, machineLo);
  if (lo <= coverHi) {
    if (aim < lo)
      return { grade: lo, limit: lo === p.minimumGrade ? 'minimum grade' : 'maximum depth' };
    if (aim > coverHi) return { grade: coverHi, limit: 'minimum cover' };
    return { grade: aim, limit: 'design depth' };
  }
  // The bounds conflict: keep the minimum grade, then the cover; the rest is flagged.
  if (coverHi <= p.minimumGrade) return { grade: p.minimumGrade, limit: 'minimum grade' };
  if (aim < p.minimumGrade) return { grade: p.minimumGrade, limit: 'minimum grade' };
  if (aim > coverHi) return { grade: coverHi, limit: 'minimum cover' };
  return { grade: aim, limit: 'design depth' };
}
