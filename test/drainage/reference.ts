// Independent evaluations of the published drain design equations, shared by the tests. Each
// is written straight from its printed form, term by term, and never calls src/.

/**
 * van der Molen & Wesseling (1991) F(x) as printed in Ritzema (1994, Drainage Principles and
 * Applications, ILRI Publ. 16, ch. 8): sum over odd n of 4 e^{-2nx} / (n (1 - e^{-2nx})),
 * summed term by term until the terms no longer count.
 */
export function vdmwSeriesF(x: number): number {
  let f = 0;
  for (let n = 1; n < 2_000_001; n += 2) {
    const e = Math.exp(-2 * n * x);
    const term = (4 * e) / (n * (1 - e));
    f += term;
    if (term < 1e-18 * f) break;
  }
  return f;
}

/** vdMW equivalent depth d = (pi L / 8) / (ln(L / (pi r0)) + F(2 pi D / L)), uncapped. */
export function vdmwDepthRaw(L: number, D: number, r0: number, F = vdmwSeriesF): number {
  return (Math.PI * L) / 8 / (Math.log(L / (Math.PI * r0)) + F((2 * Math.PI * D) / L));
}

/** vdMW equivalent depth, never more than the layer thickness D. */
export function vdmwDepth(L: number, D: number, r0: number): number {
  return Math.min(vdmwDepthRaw(L, D, r0), D);
}

/**
 * Moody (1966, J. Irrig. Drain. Div. ASCE 92(IR2)), as quoted in drainage texts (from memory):
 *   D/L <= 0.3: d = D / (1 + D/L (8/pi ln(D/r0) - a)), a = 3.55 - 1.6 D/L + 2 (D/L)^2
 *   D/L >  0.3: d = pi L / (8 (ln(L/r0) - 1.15))
 * uncapped.
 */
export function moodyDepthRaw(L: number, D: number, r0: number): number {
  const u = D / L;
  if (u <= 0.3) {
    return D / (1 + u * ((8 / Math.PI) * Math.log(D / r0) - (3.55 - 1.6 * u + 2 * u * u)));
  }
  return (Math.PI * L) / (8 * (Math.log(L / r0) - 1.15));
}

/** Moody's equivalent depth, never more than the layer thickness D. */
export function moodyDepth(L: number, D: number, r0: number): number {
  return Math.min(moodyDepthRaw(L, D, r0), D);
}

/** Hooghoudt (1940), as in Ritzema (1994) ch. 8: q = (8 K2 d h + 4 K1 h^2) / L^2. */
export const hooghoudtQ = (k1: number, k2: number, d: number, h: number, L: number) =>
  (8 * k2 * d * h + 4 * k1 * h * h) / (L * L);

/**
 * Glover-Dumm midpoint ratio for an initially flat water table (Dumm 1954; Ritzema 1994 ch. 8):
 * (4/pi) sum over odd n of (-1)^((n-1)/2) exp(-n^2 y) / n, summed term by term until the terms
 * fall below 1e-18 of the sum (an alternating series: the error is below the first term left
 * out), or at most `terms` terms.
 */
export function gloverSeriesRatio(y: number, terms = 200_000): number {
  let s = 0;
  for (let i = 0; i < terms; i++) {
    const n = 2 * i + 1;
    const term = Math.exp(-n * n * y) / n;
    s += (i % 2 === 0 ? 1 : -1) * term;
    if (term < 1e-18 * Math.abs(s)) break;
  }
  return (4 / Math.PI) * s;
}

/** Exact unit definitions (NIST Handbook 44, Appendix C): 1 ft = 0.3048 m, so 1 ft3 in m3. */
export const M3S_PER_CFS = 0.3048 ** 3;

/** Manning, SI form, full circular pipe (Chow 1959): Q = (1/n) (pi D^2/4) (D/4)^(2/3) S^(1/2). */
export const manningQ = (D: number, S: number, n: number) =>
  (1 / n) * ((Math.PI * D * D) / 4) * Math.pow(D / 4, 2 / 3) * Math.sqrt(S);

/** Inch-pound drain-design form (US drainage guides): D(in) = 16 (q n / S^0.5)^(3/8), q ft3/s. */
export const inchD = (qCfs: number, S: number, n: number) =>
  16 * Math.pow((qCfs * n) / Math.sqrt(S), 3 / 8);
