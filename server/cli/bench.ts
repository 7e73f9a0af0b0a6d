/**
 * `npm run bench [-- --json]`: median milliseconds of each workload (bench-workloads.ts) for n = 40, 120, 500,
 * 2,000 and 10,000 with B = 10,000 resamples, beside a plain sort-per-resample version timed in the same run.
 * Fewer repetitions for the large rows (shown in the runs columns); a warm-up run before timing the small ones;
 * from n = 2,000 the naive versions draw a tenth of the resamples and their time is multiplied by 10.
 * median-ci is also timed against a tight C loop (bench-c/median-ci.c, compiled here at start; skipped with a
 * note when gcc is missing): the same resamples, medians and percentile CI. Its runs alternate with the
 * engine's, one engine run then one C run (a fresh process that makes one untimed run, then the timed one), the
 * same number of runs, so that both medians see the same load on a shared machine; the median-ci row's ms is
 * the engine's median from these runs. The C CI and SE must equal the engine's (differenceBias's median for the
 * same seed), which shows that the C loop did the same work.
 * Then the plan workload (bench-plan.ts): a 1,000-study plan over 7 sizes for Deming and Passing–Bablok.
 * `--plan-only` runs the plan workload alone.
 */
import { execFileSync } from 'child_process';
import * as fs from 'fs';
import * as os from 'os';
import * as path from 'path';
import { bootQuantileSorted } from '@shared/stats/confidence-interval';
import { differenceBias } from '@shared/stats/difference-bias';
import { streamFor } from '@shared/stats/rng';
import { benchData, FULL_B, REGRESSION_RESAMPLES, SEED, takeCredit, WORKLOADS, type Workload } from './bench-workloads';
import { useStyle, type SortStyle } from './bench-naive';
import { planBench, planBlock } from './bench-plan';

const SIZES = [40, 120, 500, 2000, 10_000];
const B = FULL_B;
/** From this n on, naive runs draw a tenth of the resamples and their time is multiplied by 10 (cost is linear in B). */
const NAIVE_SCALED_FROM = 2000;
/** The C yardstick: its workload, the level of its CI, the target ratio and the sizes the target is judged at. */
const C_WORKLOAD = 'median-ci';
const C_LEVEL = 0.95;
const C_TARGET = 2;
const C_TARGET_SIZES = [500, 2000];
const GCC_FLAGS = ['-O2', '-march=native', '-ffp-contract=off'];

type Pair = [number, number];
interface CFigures { cMs: number; ratioToC: number; engineCi: Pair; cCi: Pair; sameCi: boolean; engineSe: number; cSe: number; sameSe: boolean }
interface Row extends Partial<CFigures> { workload: string; n: number; resamples: number; ms: number; naiveMs: number; typedSortMs: number; runs: number; naiveRuns: number; cNote?: string; note?: string }

function median(times: number[]): number {
  const sorted = [...times].sort((a, b) => a - b);
  return sorted[(sorted.length - 1) >> 1];
}

function timedMs(run: () => void): number {
  const start = performance.now();
  run();
  return performance.now() - start + takeCredit();
}

function medianMs(run: () => void, runs: number, warmUp: boolean): number {
  if (warmUp) { run(); takeCredit(); }
  return median(Array.from({ length: runs }, () => timedMs(run)));
}

/** The compiled C yardstick, or why there is none. */
type CProgram = { binary: string; dir: string } | { reason: string };

function compileC(): CProgram {
  const source = path.join(__dirname, 'bench-c', 'median-ci.c');
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'parallax-bench-c-'));
  const binary = path.join(dir, 'median-ci');
  try {
    execFileSync('gcc', [...GCC_FLAGS, '-o', binary, source, '-lm'], { stdio: ['ignore', 'pipe', 'pipe'] });
    return { binary, dir };
  } catch (e) {
    fs.rmSync(dir, { recursive: true, force: true });
    const err = e as NodeJS.ErrnoException & { stderr?: Buffer };
    return { reason: err.code === 'ENOENT' ? 'gcc not found' : `gcc failed: ${String(err.stderr ?? err.message).trim().split('\n')[0]}` };
  }
}

/**
 * The weight of boot's norm.inter between ranks k and k + 1 at this alpha for B replicates (it depends on B
 * and alpha only): the engine's own bootQuantileSorted read on a 0/1 step at rank k, so the C loop need not
 * port jStat's inverse normal to give the same bounds.
 */
function interpolationWeight(alpha: number): number {
  const k = Math.trunc((B + 1) * alpha);
  const step = new Float64Array(B);
  step.fill(1, Math.max(0, k));
  return bootQuantileSorted(step, alpha);
}

/**
 * The engine's workload and the C loop at n, run alternately (engine, then C) `runs` times after the engine's
 * warm-up; their median times, and the C CI and SE against the engine's.
 */
function measureWithC(w: Workload, binary: string, n: number, runs: number, warmUp: boolean): { ms: number } & CFigures {
  const values = benchData(n).values;
  const args = [n, B, 1, 1, ...streamFor(SEED, 'differences').stateWords(),
    interpolationWeight((1 - C_LEVEL) / 2), interpolationWeight((1 + C_LEVEL) / 2)].map(String);
  const input = Buffer.from(values.buffer, values.byteOffset, values.byteLength);
  const runC = (): number[] => execFileSync(binary, args, { input }).toString().trim().split(/\s+/).map(Number);
  if (warmUp) { w.engine(n, B); takeCredit(); }
  const engineTimes: number[] = [];
  const cTimes: number[] = [];
  let out: number[] = [];
  for (let k = 0; k < runs; k++) {
    engineTimes.push(timedMs(() => w.engine(n, B)));
    out = runC();
    cTimes.push(out[0]);
  }
  const [, low, high, cSe] = out;
  const ms = median(engineTimes);
  const cMs = median(cTimes);
  const engine = differenceBias(values, { resamples: B, seed: SEED, level: C_LEVEL, interval: 'percentile', loaMultiplier: 1.96 }).median;
  const engineCi: Pair = engine.ci ? [engine.ci[0], engine.ci[1]] : [NaN, NaN];
  return {
    ms, cMs: round(cMs, 100), ratioToC: round(ms / cMs, 100), engineCi, cCi: [low, high], sameCi: engineCi[0] === low && engineCi[1] === high,
    engineSe: engine.se, cSe, sameSe: engine.se === cSe,
  };
}

function measure(w: Workload, n: number, c: CProgram): Row {
  const runs = n <= 500 ? 7 : 3;
  const naiveRuns = n <= 120 ? 3 : 1;
  let measured: { ms: number } & (CFigures | { cNote?: string }) | undefined;
  if (w.name === C_WORKLOAD && 'binary' in c) {
    try {
      measured = measureWithC(w, c.binary, n, runs, n <= 500);
    } catch (e) {
      measured = { ms: medianMs(() => w.engine(n, B), runs, n <= 500), cNote: `the C run failed: ${String((e as Error).message).split('\n')[0]}` };
    }
  }
  const { ms, ...cFigures } = measured ?? { ms: medianMs(() => w.engine(n, B), runs, n <= 500) };
  const factor = n >= NAIVE_SCALED_FROM ? 10 : 1;
  const naive = (s: SortStyle): number => {
    useStyle(s);
    return factor * medianMs(() => w.naive(n, B / factor), naiveRuns, n <= 120);
  };
  const naiveMs = naive('plain');
  const typedSortMs = naive('typed');
  const notes = [w.note(n), factor > 1 ? `naive versions timed on ${B / factor} resamples and scaled x${factor}` : ''].filter(Boolean).join('; ');
  return { workload: w.name, n, resamples: B, ms: round(ms), naiveMs: round(naiveMs), typedSortMs: round(typedSortMs), runs, naiveRuns, ...cFigures, ...(notes ? { note: notes } : {}) };
}

const round = (v: number, scale = 10): number => Math.round(v * scale) / scale;

function table(rows: Row[]): string {
  const head = ['workload', 'n', 'B', 'ms', 'naive ms', 'speed-up', 'typed-sort ms', 'speed-up', 'runs', 'naive runs'];
  const body = rows.map((r) => [r.workload, String(r.n), String(r.resamples), r.ms.toFixed(1), r.naiveMs.toFixed(1), `${(r.naiveMs / r.ms).toFixed(1)}x`,
    r.typedSortMs.toFixed(1), `${(r.typedSortMs / r.ms).toFixed(1)}x`, String(r.runs), String(r.naiveRuns)]);
  const notes = rows.filter((r) => r.note).map((r) => `  ${r.workload} n=${r.n}: ${r.note}`);
  return [...aligned(head, body), '', "naive ms: a new array per resample sorted with (a, b) => a - b; typed-sort ms: one reused Float64Array and the native numeric sort.", 'notes:', ...notes].join('\n');
}

function aligned(head: string[], body: string[][]): string[] {
  const widths = head.map((h, k) => Math.max(h.length, ...body.map((b) => b[k].length)));
  const line = (cells: string[]): string => cells.map((c, k) => (k === 0 ? c.padEnd(widths[k]) : c.padStart(widths[k]))).join('  ');
  return [line(head), ...body.map(line)];
}

const ciText = (ci: Pair): string => `[${ci[0]}, ${ci[1]}]`;

function cBlock(rows: Row[], c: CProgram): string {
  const title = `${C_WORKLOAD} against a tight C loop (server/cli/bench-c/median-ci.c, gcc ${GCC_FLAGS.join(' ')}; same resamples, medians and CI; runs alternating with the engine's, same number)`;
  if (!('binary' in c)) return `${title}: not measured (${c.reason})`;
  const head = ['n', 'engine ms', 'C ms', 'ratio', 'engine CI', 'C against the engine'];
  const mine = rows.filter((r) => r.workload === C_WORKLOAD);
  const failed = mine.filter((r) => r.cMs === undefined).map((r) => `  n=${r.n}: not measured (${r.cNote ?? 'no C figures'})`);
  const body = mine.filter((r) => r.cMs !== undefined).map((r) => [String(r.n), r.ms.toFixed(1), r.cMs!.toFixed(2),
    `${r.ratioToC!.toFixed(2)}x`, ciText(r.engineCi!), [
      r.sameCi ? 'same CI' : `C CI ${ciText(r.cCi!)} differs by ${r.cCi![0] - r.engineCi![0]}, ${r.cCi![1] - r.engineCi![1]}`,
      r.sameSe ? 'same SE' : `C SE ${r.cSe} differs by ${r.cSe! - r.engineSe!}`,
    ].join(', ')]);
  return [`${title}:`, ...(body.length ? aligned(head, body) : []), ...failed,
    'ratio = engine ms / C ms; the SE sums all B medians in draw order, so an SE equal to the last bit checks every replicate, not only the two at the CI ranks'].join('\n');
}

function targets(rows: Row[], c: CProgram): string {
  const find = (w: string, n: number): Row => rows.find((r) => r.workload === w && r.n === n)!;
  const m500 = find('median-ci', 500);
  const c120 = find('comparison', 120);
  const cTargets = C_TARGET_SIZES.map((n) => {
    const r = find(C_WORKLOAD, n);
    const label = `target: ${C_WORKLOAD} n=${n} within ${C_TARGET}x of the tight C loop`;
    if (!('binary' in c) || r.ratioToC === undefined) return `${label}: not measured (${'reason' in c ? c.reason : r.cNote ?? 'no C figures'})`;
    const same = r.sameCi && r.sameSe;
    const sameWork = same ? 'same CI and SE' : 'CI or SE DIFFERS, so not the same work';
    return `${label}: ${r.ratioToC.toFixed(2)}x (engine ${r.ms} ms, C ${r.cMs} ms; ${sameWork}) ${r.ratioToC < C_TARGET && same ? 'met' : 'NOT met'}`;
  });
  return [
    ...cTargets,
    `target: median-ci n=500 at least 30x faster than sort-per-resample: ${(m500.naiveMs / m500.ms).toFixed(1)}x against the plain version ${m500.naiveMs / m500.ms >= 30 ? 'met' : 'NOT met'}, ${(m500.typedSortMs / m500.ms).toFixed(1)}x against the typed-array sort ${m500.typedSortMs / m500.ms >= 30 ? 'met' : 'NOT met'}`,
    `target: comparison n=120, B=10,000 (${REGRESSION_RESAMPLES} regression) under 300 ms: ${c120.ms} ms ${c120.ms < 300 ? 'met' : 'NOT met'}`,
    ...([[2000, 1500], [10_000, 10_000]] as const).map(([n, limit]) => {
      const r = rows.find((x) => x.workload === 'comparison' && x.n === n);
      return r ? `target: comparison n=${n} with Passing–Bablok, B=10,000 (${REGRESSION_RESAMPLES} regression) under ${limit} ms: ${r.ms} ms ${r.ms < limit ? 'met' : 'NOT met'}` : `target: comparison n=${n}: not run`;
    }),
    'memory: one Int32Array of n counts per loop and 8 bytes per resample per kept statistic; no B x n matrix',
  ].join('\n');
}

/** Fresh processes per size for the C ratio: the engine's loop runs at one of two speeds in a given process (same V8 optimisation trace). */
const RATIO_PROCESSES = 5;

/** `--ratio-only N BINARY`: one fresh process's median-ci engine and C times at n = N, as JSON (used by main). */
function ratioOnly(n: number, binary: string): void {
  const w = WORKLOADS.find((x) => x.name === C_WORKLOAD)!;
  const r = measureWithC(w, binary, n, 7, true);
  process.stdout.write(`${JSON.stringify({ ms: r.ms, cMs: r.cMs, same: r.sameCi && r.sameSe })}\n`);
}

interface Spread { n: number; ratios: number[]; median: number; same: boolean }

/** The engine/C ratio at each target size in RATIO_PROCESSES fresh processes (each alternating 7 engine and 7 C runs). */
function ratioSpread(c: CProgram): Spread[] {
  if (!('binary' in c)) return [];
  return C_TARGET_SIZES.map((n) => {
    const runs = Array.from({ length: RATIO_PROCESSES }, () => JSON.parse(execFileSync(process.execPath,
      [...process.execArgv, __filename, '--ratio-only', String(n), c.binary]).toString()) as { ms: number; cMs: number; same: boolean });
    const ratios = runs.map((r) => round(r.ms / r.cMs, 100)).sort((a, b) => a - b);
    return { n, ratios, median: ratios[(ratios.length - 1) >> 1], same: runs.every((r) => r.same) };
  });
}

function spreadBlock(spread: Spread[]): string {
  if (!spread.length) return '';
  return ['median-ci engine/C ratio in fresh processes (the engine loop runs at one of two speeds in a given process):',
    ...spread.map((s) => `  n=${s.n}: ${s.ratios.map((r) => `${r.toFixed(2)}x`).join(', ')}; median ${s.median.toFixed(2)}x${s.same ? '' : ' (CI or SE differed in a run)'}`),
    ...spread.map((s) => `target: median-ci n=${s.n} within ${C_TARGET}x of the tight C loop, median of ${s.ratios.length} processes: ${s.median.toFixed(2)}x ${s.median < C_TARGET && s.same ? 'met' : 'NOT met'}; slowest process ${s.ratios.at(-1)!.toFixed(2)}x`),
  ].join('\n');
}

async function main(): Promise<void> {
  const only = process.argv.indexOf('--ratio-only');
  if (only >= 0) return ratioOnly(Number(process.argv[only + 1]), process.argv[only + 2]);
  const json = process.argv.includes('--json');
  const log = (line: string): void => { if (!json) process.stderr.write(`${line}\n`); };
  if (process.argv.includes('--plan-only')) {
    const plans = await planBench(log);
    process.stdout.write(json ? `${JSON.stringify({ plans })}\n` : `${planBlock(plans)}\n`);
    return;
  }
  const c = compileC();
  if ('reason' in c) process.stderr.write(`  no C yardstick for ${C_WORKLOAD}: ${c.reason}; the ratio is skipped\n`);
  try {
    const rows: Row[] = [];
    for (const n of SIZES) {
      for (const w of WORKLOADS) {
        rows.push(measure(w, n, c));
        if (!json) process.stderr.write(`  ${w.name} n=${n} done\n`);
      }
    }
    const spread = ratioSpread(c);
    const plans = await planBench(log);
    process.stdout.write(json ? `${JSON.stringify({ rows, ratioToC: spread, plans })}\n` : `${table(rows)}\n\n${cBlock(rows, c)}\n\n${spreadBlock(spread)}\n\n${targets(rows, c)}\n\n${planBlock(plans)}\n`);
  } finally {
    if ('dir' in c) fs.rmSync(c.dir, { recursive: true, force: true });
  }
}

void main();
