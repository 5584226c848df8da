/*
 * The daily sub-steps of src/engine/simulate.ts in plain C: a yardstick for the engine benchmark
 * (engine-vs-c.bench.mjs), which compiles it with the machine's gcc -O2 and reports how many
 * times slower the JavaScript engine is on the same forcing and layout.
 *
 * The JavaScript side resolves what is constant over a run (the porosity table, the Hooghoudt
 * and Kirkham coefficients of each outlet level, the sub-step counts) and writes them with the
 * daily columns to a file of float64 values; this program runs the same daily loop over it
 * (infiltration, ET from ponded water / water table / root zone, Hooghoudt outflow solved
 * exactly over each sub-step, seepage, late infiltration, runoff, the daily balance and its
 * yearly check), writes the same sixteen daily columns, and prints the CPU time per run and
 * sums of the daily fluxes, which the benchmark compares with the JavaScript run.
 *
 * Usage: engine-kernel INPUT.f64 MIN_SECONDS
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <time.h>

typedef struct {
  int n;
  const double *tops, *bottoms, *values, *airAtTop;
  double maxAir, barrier;
} Table;

typedef struct {
  double depth, a, b, k0, k1, outletAir;
} Level;

static double airAbove(const Table *t, double d) {
  if (d <= 0) return 0;
  if (d >= t->barrier) return t->maxAir;
  int i = 0;
  while (i < t->n - 1 && d > t->bottoms[i]) i++;
  return t->airAtTop[i] + t->values[i] * (d - t->tops[i]) * 1000;
}

static double depthForAir(const Table *t, double air) {
  if (air <= 0) return 0;
  if (air >= t->maxAir) return t->barrier;
  int i = 0;
  while (i < t->n - 1 && air > t->airAtTop[i + 1]) i++;
  return t->tops[i] + (air - t->airAtTop[i]) / (t->values[i] * 1000);
}

static double porosityAt(const Table *t, double d) {
  int i = 0;
  while (i < t->n - 1 && d >= t->bottoms[i]) i++;
  return t->values[i];
}

static double drainStep(const Table *t, const Level *lv, double air, double recharge, double dt) {
  double depth = depthForAir(t, air);
  double h0 = fmax(0, lv->depth - depth);
  double mu = porosityAt(t, depth) * 1000;
  double A = lv->a * 1000, B = lv->b * 1000, r = recharge / dt, hEnd;
  if (B <= 0) {
    double hEq = A > 0 ? r / A : INFINITY;
    hEnd = A > 0 ? hEq + (h0 - hEq) * exp((-A * dt) / mu) : h0 + (r * dt) / mu;
  } else {
    double root = sqrt(A * A + 4 * B * r);
    double h1 = (-A + root) / (2 * B), h2 = (-A - root) / (2 * B);
    double e = exp((-B * (h1 - h2) * dt) / mu);
    double c = (h0 - h1) / (h0 - h2);
    hEnd = (h1 - c * h2 * e) / (1 - c * e);
  }
  if (hEnd > lv->depth) hEnd = lv->depth;
  if (hEnd < 0) hEnd = 0;
  double dq = airAbove(t, lv->depth - hEnd) - air + recharge;
  double cap = lv->outletAir - air + recharge;
  return dq < cap ? dq : cap;
}

static double min2(double a, double b) { return a < b ? a : b; }

int main(int argc, char **argv) {
  if (argc < 3) {
    fprintf(stderr, "usage: engine-kernel INPUT.f64 MIN_SECONDS\n");
    return 2;
  }
  FILE *f = fopen(argv[1], "rb");
  if (!f) {
    perror(argv[1]);
    return 2;
  }
  fseek(f, 0, SEEK_END);
  long bytes = ftell(f);
  fseek(f, 0, SEEK_SET);
  double *in = malloc(bytes);
  if (fread(in, 1, bytes, f) != (size_t)bytes) return 2;
  fclose(f);
  /* Header (the order written by engine-vs-c.bench.mjs). */
  const double *h = in;
  int n = (int)h[0], nLayers = (int)h[1], nLevels = (int)h[2];
  int steps = (int)h[3], drySteps = (int)h[4];
  double initialAir = h[5], tawPerM = h[6], kAbove = h[7], capacityPerDay = h[8];
  double decay = h[9], surfaceStorage = h[10], barrier = h[11], seepConst = h[12];
  double seepConductance = h[13];
  int hasSeepage = (int)h[14], hasSp = (int)h[15];
  double leakance = h[16], regionalHead = h[17], lateralK = h[18], edgeDistance = h[19];
  double edgeLevel = h[20], maxAir = h[21], swePrev0 = h[22], tolerance = h[23];
  const double *p = in + 24;
  Table t = {nLayers, p, p + nLayers, p + 2 * nLayers, p + 3 * nLayers, maxAir, barrier};
  p += 4 * nLayers;
  Level *levels = malloc(sizeof(Level) * nLevels);
  for (int k = 0; k < nLevels; k++, p += 5) {
    levels[k] = (Level){p[0], p[1], p[2], p[3], p[4], 0};
    levels[k].outletAir = airAbove(&t, p[0]);
  }
  const double *rain = p, *melt = p + n, *sweIn = p + 2 * n, *precip = p + 3 * n;
  const double *kc = p + 4 * n, *refEt = p + 5 * n, *pDeplIn = p + 6 * n;
  const double *rootIn = p + 7 * n, *levelIn = p + 8 * n, *yearIn = p + 9 * n;

  double *cols = malloc(sizeof(double) * 16 * (size_t)n);
  double *oEt = cols, *oPot = cols + n, *oRunoff = cols + 2 * n, *oInf = cols + 3 * n;
  double *oDrain = cols + 4 * n, *oSeep = cols + 5 * n, *oLat = cols + 6 * n;
  double *oWtd = cols + 7 * n, *oOut = cols + 8 * n, *oPond = cols + 9 * n;
  double *oDepl = cols + 10 * n, *oKs = cols + 11 * n, *oSoil = cols + 12 * n;
  double *oSat = cols + 13 * n, *oErr = cols + 14 * n;
  unsigned char *oLim = malloc(n);
  double minSeconds = atof(argv[2]);
  struct timespec t0, t1;
  clock_gettime(CLOCK_PROCESS_CPUTIME_ID, &t0);
  long runs = 0;
  double elapsed = 0;
  do {
    double air = initialAir, depletion = 0, surface = 0, swePrev = swePrev0, yearError = 0;
    int year = (int)yearIn[0];
    for (int i = 0; i < n; i++) {
      double waterIn = rain[i] + melt[i];
      double potEt = sweIn[i] > 0 ? 0 : kc[i] * refEt[i];
      double pDepl = pDeplIn[i];
      const Level *lv = &levels[(int)levelIn[i]];
      double outletAir = lv->outletAir;
      double rootZone = rootIn[i], taw = tawPerM * rootZone;
      int limited = 0;
      double lateral = 0, storeStart = -(air + depletion) + surface;
      double et = 0, runoff = 0, infil = 0, drain = 0, seep = 0, ksSum = 0;
      int nSteps = waterIn > 0 || surface > 0 ? steps : drySteps;
      double dt = 1.0 / nSteps, infCap = kAbove * 1000 * dt, capacity = capacityPerDay * dt;
      for (int s = 0; s < nSteps; s++) {
        surface += waterIn * dt;
        double inf = min2(min2(surface, depletion + air), infCap);
        if (inf < 0) inf = 0;
        surface -= inf;
        infil += inf;
        double refill = min2(inf, depletion);
        depletion -= refill;
        double recharge = inf - refill;
        double demand = potEt * dt;
        double evap = min2(surface, demand);
        surface -= evap;
        demand -= evap;
        double below = depthForAir(&t, air) - rootZone;
        double share = below <= 0 ? 1 : exp(-below / decay);
        double fromTable = min2(demand * share, maxAir - air);
        air += fromTable;
        demand -= fromTable;
        double ks;
        if (taw > 0) {
          double raw = pDepl * taw;
          ks = depletion <= raw ? 1 : fmax(0, (taw - depletion) / ((1 - pDepl) * taw));
        } else
          ks = 0;
        double fromRoots = fmax(0, min2(demand * ks, taw - depletion));
        depletion += fromRoots;
        et += evap + fromTable + fromRoots;
        ksSum += ks;
        if (air > outletAir) {
          double fill = min2(recharge, air - outletAir);
          air -= fill;
          recharge -= fill;
        }
        if (recharge > 0 || air < outletAir) {
          double dq;
          if (air - recharge <= 0 && surface > 0) {
            double hd = lv->depth;
            double q = lv->a * hd + lv->b * hd * hd;
            double qk = lv->k0 + (lv->k1 * surface) / 1000;
            if (qk > q) q = qk;
            air -= recharge;
            dq = min2(q * 1000 * dt, outletAir - air);
          } else {
            dq = drainStep(&t, lv, air, recharge, dt);
            air -= recharge;
          }
          if (dq > capacity) {
            dq = capacity;
            limited = 1;
          }
          if (dq < 0) dq = 0;
          air += dq;
          if (air < 0) air = 0;
          drain += dq;
        }
        if (air < maxAir && hasSeepage) {
          double wt = depthForAir(&t, air);
          double rate = seepConst + seepConductance * (barrier - wt), side = 0;
          if (hasSp) {
            if (leakance > 0 && wt < barrier) {
              double dh = regionalHead - wt;
              rate += dh > 0 ? leakance * dh * 1000 : 0;
            }
            if (lateralK > 0 && isfinite(edgeDistance)) {
              double H = barrier - wt, He = fmax(0, barrier - edgeLevel);
              if (H > He) side = ((lateralK * (H * H - He * He)) / (edgeDistance * edgeDistance)) * 1000;
            }
            rate += side;
          }
          double ds = min2(rate * dt, maxAir - air);
          air += ds;
          seep += ds;
          if (side > 0) lateral += (ds * side) / rate;
        }
        if (surface > 0 && infil < infCap * (s + 1)) {
          double late = min2(min2(surface, depletion + air), infCap - inf);
          if (late > 0) {
            surface -= late;
            infil += late;
            double refillLate = min2(late, depletion);
            depletion -= refillLate;
            late -= refillLate;
            air -= late;
          }
        }
        if (surface > surfaceStorage) {
          runoff += surface - surfaceStorage;
          surface = surfaceStorage;
        }
      }
      double wtd = depthForAir(&t, air);
      double storeEnd = -(air + depletion) + surface;
      double err = precip[i] - et - runoff - drain - seep - (storeEnd - storeStart) - (sweIn[i] - swePrev);
      swePrev = sweIn[i];
      oEt[i] = et;
      oPot[i] = potEt;
      oRunoff[i] = runoff;
      oInf[i] = infil;
      oDrain[i] = drain;
      oSeep[i] = seep;
      oLat[i] = lateral;
      oLim[i] = limited;
      oWtd[i] = wtd;
      oOut[i] = lv->depth;
      oPond[i] = surface;
      oDepl[i] = depletion;
      oKs[i] = ksSum / nSteps;
      oSoil[i] = -(air + depletion);
      double sat = 1.0 - wtd;
      oSat[i] = sat < 0 ? 0 : sat > 1 ? 1 : sat;
      oErr[i] = err;
      int y = (int)yearIn[i];
      if (y != year) {
        yearError = 0;
        year = y;
      }
      yearError += err;
      if (fabs(yearError) > tolerance) {
        fprintf(stderr, "water balance not closed in %d: %g mm\n", y, yearError);
        return 1;
      }
    }
    runs++;
    clock_gettime(CLOCK_PROCESS_CPUTIME_ID, &t1);
    elapsed = (t1.tv_sec - t0.tv_sec) + (t1.tv_nsec - t0.tv_nsec) * 1e-9;
  } while (elapsed < minSeconds);
  double sums[5] = {0, 0, 0, 0, 0};
  for (int i = 0; i < n; i++) {
    sums[0] += oDrain[i];
    sums[1] += oRunoff[i];
    sums[2] += oEt[i];
    sums[3] += oSeep[i];
    sums[4] += oWtd[i];
  }
  printf("{\"msPerRun\":%.9g,\"runs\":%ld,\"drainflowMm\":%.17g,\"runoffMm\":%.17g,"
         "\"etMm\":%.17g,\"seepageMm\":%.17g,\"waterTableDepthM\":%.17g}\n",
         1000 * elapsed / runs, runs, sums[0], sums[1], sums[2], sums[3], sums[4]);
  return 0;
}
