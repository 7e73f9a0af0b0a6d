/*
 * The 'median-ci' workload of `npm run bench` as a tight C loop, the yardstick for the engine's time.
 * bench.ts compiles this file at start (gcc -O2 -march=native -ffp-contract=off ... -lm) and runs it once per
 * engine run, alternating with the engine (so both see the same load), each time with one untimed warm-up run
 * and one timed run; the bench takes the median over the same number of runs as the engine's. Run by hand with
 * more runs, it prints the median of its own runs.
 *
 *   median-ci <n> <B> <runs> <warm-up 0|1> <x> <y> <z> <w> <weight-low> <weight-high>
 *   stdin: the n data values as little-endian float64 (benchData(n).values, unsorted)
 *   stdout: "<median ms> <CI low> <CI high> <SE>" (the figures with 17 significant digits)
 *
 * One run does what the engine's workload does (bench-workloads.ts): sort the data; B resamples as counts
 * over the sorted positions, drawn from xor128 (Marsaglia 2003) started at the state words x, y, z, w
 * that Xor128 takes from seedrandom for the stream 'bench:differences' (passed by bench.ts); each draw
 * adds one to counts[floor(u * n)] with u = w / 2^32, as Xor128.fillCounts; the median of each resample
 * read off the counts by a walk from the low end to the middle, as medianFromCounts reads it (which walks
 * from the top for odd n: the same value); the B medians in one array of doubles (memory flat in B); then
 * the percentile CI at level 0.95 as summariseReplicates: the bootstrap SE, and boot's norm.inter quantile
 * at rank (B + 1)alpha, the replicates selected (quickselect) rather than sorted. The interpolation weight
 * between ranks k and k + 1 on the normal-quantile scale depends only on B and alpha; bench.ts passes the
 * engine's value so that this file need not port jStat's inverse normal.
 * -ffp-contract=off keeps a*b + c as two roundings, as in JavaScript, so the bounds are bit-identical.
 * Timing: clock_gettime(CLOCK_MONOTONIC) around each run; an optional untimed warm-up run; the median of
 * <runs> runs is printed (the same rule as bench.ts's medianMs).
 */
#include <stdint.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

static int cmp_double(const void *a, const void *b) {
  double p = *(const double *)a, q = *(const double *)b;
  return (p > q) - (p < q);
}

/* Rearranges a[lo..hi] so that a[k] is the value of rank k + 1 of the whole range (Hoare quickselect). */
static void select_kth(double *a, long lo, long hi, long k) {
  while (hi > lo) {
    double pivot = a[lo + ((hi - lo) >> 1)];
    long i = lo, j = hi;
    while (i <= j) {
      while (a[i] < pivot) i++;
      while (a[j] > pivot) j--;
      if (i <= j) { double t = a[i]; a[i] = a[j]; a[j] = t; i++; j--; }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return;
  }
}

/* boot's norm.inter on the unsorted replicates: selects ranks k and k + 1 (k = trunc((B + 1)alpha)). */
static double boot_quantile(double *r, long B, double alpha, double weight) {
  double rank = (double)(B + 1) * alpha;
  long k = (long)rank;
  if (k <= 0) { select_kth(r, 0, B - 1, 0); return r[0]; }
  if (k >= B) { select_kth(r, 0, B - 1, B - 1); return r[B - 1]; }
  select_kth(r, 0, B - 1, k - 1);
  double below = r[k - 1];
  if ((double)k == rank) return below;
  double above = r[k]; /* everything right of k - 1 is >= r[k - 1]: rank k + 1 is the least of them */
  for (long i = k + 1; i < B; i++) if (r[i] < above) above = r[i];
  return below + weight * (above - below);
}

typedef struct { double low, high, se; } Result;

static Result run(const double *data, long n, long B, const uint32_t seed[4], double weight_low, double weight_high) {
  double *sorted = malloc(n * sizeof(double));
  int32_t *counts = malloc(n * sizeof(int32_t));
  double *reps = malloc(B * sizeof(double));
  memcpy(sorted, data, n * sizeof(double));
  qsort(sorted, n, sizeof(double), cmp_double);
  uint32_t x = seed[0], y = seed[1], z = seed[2], w = seed[3];
  const double scale = (double)n * 0x1p-32; /* n / 2^32, exact */
  const long half = n >> 1;
  const int odd = (int)(n & 1);
  for (long b = 0; b < B; b++) {
    memset(counts, 0, n * sizeof(int32_t));
    for (long draw = 0; draw < n; draw++) {
      uint32_t t = x ^ (x << 11);
      x = y; y = z; z = w;
      w = w ^ (w >> 19) ^ t ^ (t >> 8);
      counts[(int32_t)((double)w * scale)]++;
    }
    /* the median from the low end: rank half + 1 (odd n), or the mean of ranks half and half + 1 */
    long seen = 0, k = 0;
    double m;
    if (odd) {
      while ((seen += counts[k]) <= half) k++;
      m = sorted[k];
    } else {
      while ((seen += counts[k]) < half) k++;
      if (seen > half) m = sorted[k];
      else {
        long next = k + 1;
        while (counts[next] == 0) next++;
        m = (sorted[k] + sorted[next]) / 2;
      }
    }
    reps[b] = m;
  }
  /* summariseReplicates: the bootstrap SE (divisor B - 1), then the percentile interval */
  double sum = 0;
  for (long b = 0; b < B; b++) sum += reps[b];
  double mean = sum / B, ss = 0;
  for (long b = 0; b < B; b++) { double d = reps[b] - mean; ss += d * d; }
  Result r;
  r.se = sqrt(ss / (B - 1));
  const double level = 0.95;
  r.low = boot_quantile(reps, B, (1 - level) / 2, weight_low);
  r.high = boot_quantile(reps, B, (1 + level) / 2, weight_high);
  free(sorted); free(counts); free(reps);
  return r;
}

static double now_ms(void) {
  struct timespec ts;
  clock_gettime(CLOCK_MONOTONIC, &ts);
  return ts.tv_sec * 1e3 + ts.tv_nsec / 1e6;
}

int main(int argc, char **argv) {
  if (argc != 11) {
    fprintf(stderr, "usage: median-ci n B runs warm-up x y z w weight-low weight-high < values.f64\n");
    return 2;
  }
  long n = atol(argv[1]), B = atol(argv[2]), runs = atol(argv[3]);
  int warm = atoi(argv[4]);
  uint32_t seed[4];
  for (int i = 0; i < 4; i++) seed[i] = (uint32_t)strtoll(argv[5 + i], NULL, 10);
  double weight_low = strtod(argv[9], NULL), weight_high = strtod(argv[10], NULL);
  if (n < 1 || B < 2 || runs < 1) { fprintf(stderr, "median-ci: need n >= 1, B >= 2, runs >= 1\n"); return 2; }
  double *data = malloc(n * sizeof(double));
  if (fread(data, sizeof(double), n, stdin) != (size_t)n) { fprintf(stderr, "median-ci: expected %ld float64 values on stdin\n", n); return 2; }
  Result r = {0, 0, 0};
  if (warm) r = run(data, n, B, seed, weight_low, weight_high);
  double *times = malloc(runs * sizeof(double));
  for (long k = 0; k < runs; k++) {
    double start = now_ms();
    r = run(data, n, B, seed, weight_low, weight_high);
    times[k] = now_ms() - start;
  }
  qsort(times, runs, sizeof(double), cmp_double);
  printf("%.6f %.17g %.17g %.17g\n", times[(runs - 1) >> 1], r.low, r.high, r.se);
  free(times); free(data);
  return 0;
}
