/**
 * `npm run bench [-- --json]`: median milliseconds of each workload (bench-workloads.ts) for n = 40, 120, 500,
 * 2,000 and 10,000 with B = 10,000 resamples, beside a plain sort-per-resample version timed in the same run.
 * Fewer repetitions for the large rows (shown in the runs columns); a warm-up run before timing the small ones;
 * from n = 2,000 the naive versions draw a tenth of the resamples and their time is multiplied by 10.
 */
import { FULL_B, REGRESSION_RESAMPLES, takeCredit, WORKLOADS, type Workload } from './bench-workloads';
import { useStyle, type SortStyle } from './bench-naive';

const SIZES = [40, 120, 500, 2000, 10_000];
const B = FULL_B;
/** From this n on, naive runs draw a tenth of the resamples and their time is multiplied by 10 (cost is linear in B). */
const NAIVE_SCALED_FROM = 2000;

interface Row { workload: string; n: number; resamples: number; ms: number; naiveMs: number; typedSortMs: number; runs: number; naiveRuns: number; note?: string }

function medianMs(run: () => void, runs: number, warmUp: boolean): number {
  if (warmUp) { run(); takeCredit(); }
  const times: number[] = [];
  for (let k = 0; k < runs; k++) {
    const start = performance.now();
    run();
    times.push(performance.now() - start + takeCredit());
  }
  times.sort((a, b) => a - b);
  return times[(times.length - 1) >> 1];
}

function measure(w: Workload, n: number): Row {
  const runs = n <= 500 ? 7 : 3;
  const naiveRuns = n <= 120 ? 3 : 1;
  const ms = medianMs(() => w.engine(n, B), runs, n <= 500);
  const factor = n >= NAIVE_SCALED_FROM ? 10 : 1;
  const naive = (s: SortStyle): number => {
    useStyle(s);
    return factor * medianMs(() => w.naive(n, B / factor), naiveRuns, n <= 120);
  };
  const naiveMs = naive('plain');
  const typedSortMs = naive('typed');
  const notes = [w.note(n), factor > 1 ? `naive versions timed on ${B / factor} resamples and scaled x${factor}` : ''].filter(Boolean).join('; ');
  return { workload: w.name, n, resamples: B, ms: round(ms), naiveMs: round(naiveMs), typedSortMs: round(typedSortMs), runs, naiveRuns, ...(notes ? { note: notes } : {}) };
}

const round = (v: number): number => Math.round(v * 10) / 10;

function table(rows: Row[]): string {
  const head = ['workload', 'n', 'B', 'ms', 'naive ms', 'speed-up', 'typed-sort ms', 'speed-up', 'runs', 'naive runs'];
  const body = rows.map((r) => [r.workload, String(r.n), String(r.resamples), r.ms.toFixed(1), r.naiveMs.toFixed(1), `${(r.naiveMs / r.ms).toFixed(1)}x`,
    r.typedSortMs.toFixed(1), `${(r.typedSortMs / r.ms).toFixed(1)}x`, String(r.runs), String(r.naiveRuns)]);
  const widths = head.map((h, k) => Math.max(h.length, ...body.map((b) => b[k].length)));
  const line = (cells: string[]): string => cells.map((c, k) => (k === 0 ? c.padEnd(widths[k]) : c.padStart(widths[k]))).join('  ');
  const notes = rows.filter((r) => r.note).map((r) => `  ${r.workload} n=${r.n}: ${r.note}`);
  return [line(head), ...body.map(line), '', "naive ms: a new array per resample sorted with (a, b) => a - b; typed-sort ms: one reused Float64Array and the native numeric sort.", 'notes:', ...notes].join('\n');
}

function targets(rows: Row[]): string {
  const find = (w: string, n: number): Row => rows.find((r) => r.workload === w && r.n === n)!;
  const m500 = find('median-ci', 500);
  const c120 = find('comparison', 120);
  return [
    `target: median-ci n=500 within 2x of a tight C loop's ~10 ms (<= 20 ms): ${m500.ms} ms ${m500.ms <= 20 ? 'met' : 'NOT met'}`,
    `target: median-ci n=500 at least 30x faster than sort-per-resample: ${(m500.naiveMs / m500.ms).toFixed(1)}x against the plain version ${m500.naiveMs / m500.ms >= 30 ? 'met' : 'NOT met'}, ${(m500.typedSortMs / m500.ms).toFixed(1)}x against the typed-array sort ${m500.typedSortMs / m500.ms >= 30 ? 'met' : 'NOT met'}`,
    `target: comparison n=120, B=10,000 (${REGRESSION_RESAMPLES} regression) under 300 ms: ${c120.ms} ms ${c120.ms < 300 ? 'met' : 'NOT met'}`,
    'memory: one Int32Array of n counts per loop and 8 bytes per resample per kept statistic; no B x n matrix',
  ].join('\n');
}

function main(): void {
  const json = process.argv.includes('--json');
  const rows: Row[] = [];
  for (const n of SIZES) {
    for (const w of WORKLOADS) {
      rows.push(measure(w, n));
      if (!json) process.stderr.write(`  ${w.name} n=${n} done\n`);
    }
  }
  process.stdout.write(json ? `${JSON.stringify(rows)}\n` : `${table(rows)}\n\n${targets(rows)}\n`);
}

main();
