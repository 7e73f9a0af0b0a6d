import { passingBablok, type PassingBablok } from './passing-bablok';
import { weightedPassingBablok } from './passing-bablok-weighted';
import { Xor128 } from './rng';
import { exactSign, keyOrder, slopeOrder, type SlopeOrderOptions } from './slope-selection';
import { slopeTable } from './slope-table';

// Selection (slope-selection.ts) against the sorted table it replaces (slope-table.ts, read as before):
// the same doubles, bit for bit (Object.is: −0 and +0 differ), for the fit and for weighted resamples.

type Data = { x: number[]; y: number[] };

/** The old way: the sorted table, read at ranks; errors as strings. */
function oldFit(d: Data): PassingBablok | string {
  try {
    return passingBablok(d.x, d.y, 0.95, slopeOrder(d.x, d.y, { mode: 'table' }));
  } catch (error) {
    return String(error);
  }
}

function newFit(d: Data, options: SlopeOrderOptions): PassingBablok | string {
  try {
    return passingBablok(d.x, d.y, 0.95, slopeOrder(d.x, d.y, options));
  } catch (error) {
    return String(error);
  }
}

/** A number as a string that keeps −0 apart from 0. */
const show = (v: number | null): string => (Object.is(v, -0) ? '-0' : String(v));

/** Every number of a fit. */
function bits(fit: PassingBablok | string): string {
  if (typeof fit === 'string') return fit;
  const cis = [...(fit.slopeCi ?? [null, null]), ...(fit.interceptCi ?? [null, null])];
  return [fit.slope, fit.intercept, fit.slopeCount, fit.belowMinusOne, ...cis].map(show).join(' ');
}

/** Invented data of many shapes; kind picks the shape, decimals the rounding. */
function dataset(s: Xor128, kind: number, n: number): Data {
  const u = (): number => s.nextUniform();
  const full = (): number => s.nextUniform() + s.nextUniform() * 2 ** -32; // 53 bits, like Math.random()
  const int = (k: number): number => s.nextIndex(k);
  const decimals = int(5);
  const round = (v: number): number => Number(v.toFixed(decimals));
  const x: number[] = [];
  const y: number[] = [];
  for (let i = 0; i < n; i++) {
    let a: number;
    let b: number;
    switch (kind) {
      case 0: a = int(8); b = int(8); break; // many ties in x and y, vertical pairs
      case 1: a = round(u() * 100); b = round(a * (1 + (u() - 0.5) * 0.2) + (u() - 0.5) * 5); break;
      case 2: a = round(u() * 50 - 25); b = round(-a + (u() < 0.3 ? 0 : (u() - 0.5) * 3)); break; // −1 and near it
      case 3: a = full() * 1e3; b = a * 1.1 + full() * 10; break; // doubles without reported decimals
      case 4: a = round(1e12 + u() * 1e3); b = round(a + u() * 10 - 5); break; // large magnitudes
      case 5: a = int(6); b = int(4) - int(3) + (u() < 0.2 ? a : -a); break; // exact −1 slopes
      case 6: a = round((u() - 0.5) * 20); b = round(-1.5 * a + (u() - 0.5) * 10); break; // most slopes below −1
      case 7: a = int(8); b = u() < 0.5 ? (u() < 0.5 ? -0 : 0) : int(3) - 1; break; // −0 among the values
      case 8: a = full() * 1e3; b = 2 * a; break; // one exact line in doubles: every slope 2 or a neighbour
      default: a = round(u() * 10); b = round(3 - 0.5 * a + (u() - 0.5) * 0.4); break;
    }
    x.push(a);
    y.push(b);
  }
  if (n > 3 && u() < 0.4) {
    // Duplicated rows and a shared x.
    x[1] = x[0];
    y[1] = y[0];
    x[2] = x[0];
  }
  return { x, y };
}

/** The configurations compared with the table: both modes, and tiny samples that force many rounds. */
const CONFIGS: SlopeOrderOptions[] = [
  {},
  { mode: 'integer' },
  { mode: 'general' },
  { mode: 'integer', poolSize: 8, budget: 3 },
  { mode: 'general', poolSize: 5, budget: 4 },
];

describe('Passing–Bablok by slope selection equals the sorted table, bit for bit', () => {
  it('on 320 invented data sets (fit, CIs, N, K and weighted resamples)', () => {
    const s = new Xor128('passing-bablok-fast');
    const problems: string[] = [];
    let compared = 0;
    for (let set = 0; set < 320; set++) {
      const kind = set % 10;
      const n = 2 + s.nextIndex(set < 300 ? 150 : 400);
      const d = dataset(s, kind, n);
      const expected = bits(oldFit(d));
      const table = slopeTable(d.x, d.y);
      const scratch = new Float64Array(n);
      const resamples = Array.from({ length: 4 }, () => {
        const counts = new Int32Array(n);
        s.fillCounts(counts, n);
        return counts;
      });
      const old = resamples.map((c) => weightedPassingBablok(table, d.x, d.y, c, scratch));
      // The default and two others per set (all five every fifth set), to keep the run short.
      const configs = set % 5 === 0 ? CONFIGS : [CONFIGS[0], CONFIGS[1 + (set % 4)], CONFIGS[1 + ((set + 2) % 4)]];
      for (const options of configs) {
        const order = slopeOrder(d.x, d.y, options);
        const got = bits(newFit(d, options));
        if (got !== expected) problems.push(`set ${set} (kind ${kind}, n ${n}, ${JSON.stringify(options)}): ${got} ≠ ${expected}`);
        resamples.forEach((counts, r) => {
          const now = weightedPassingBablok(order, d.x, d.y, counts, scratch);
          if (!Object.is(now.slope, old[r].slope) || !Object.is(now.intercept, old[r].intercept)) {
            problems.push(`set ${set} resample ${r} (${JSON.stringify(options)}): ${show(now.slope)}, ${show(now.intercept)} ≠ ${show(old[r].slope)}, ${show(old[r].intercept)}`);
          }
        });
        compared++;
      }
    }
    expect(problems.slice(0, 5)).toEqual([]);
    expect(compared).toBeGreaterThan(900);
  });

  it('on 3,000 pairs with ties (threshold grid and prediction in use), fit and resamples', () => {
    const s = new Xor128('passing-bablok-fast-large');
    const x = Array.from({ length: 3000 }, () => Math.round((2 + 48 * s.nextUniform()) * 10) / 10);
    const y = x.map((v) => Math.round((1.02 * v + 0.3 + (s.nextUniform() - 0.5) * 2) * 10) / 10);
    const order = slopeOrder(x, y);
    expect(order.mode).toBe('integer');
    expect(bits(passingBablok(x, y, 0.95, order))).toBe(bits(oldFit({ x, y })));
    const table = slopeTable(x, y);
    const counts = new Int32Array(x.length);
    const scratch = new Float64Array(x.length);
    for (let r = 0; r < 25; r++) {
      s.fillCounts(counts, x.length);
      const old = weightedPassingBablok(table, x, y, counts, scratch);
      const now = weightedPassingBablok(order, x, y, counts, scratch);
      expect([show(now.slope), show(now.intercept)]).toEqual([show(old.slope), show(old.intercept)]);
    }
  });
});

describe('slope selection on small cases checked by hand', () => {
  const modes: SlopeOrderOptions[] = [{ mode: 'integer', poolSize: 2, budget: 1 }, { mode: 'general', poolSize: 2, budget: 1 }];

  it.each(modes)('shifts the median by K (%j)', (options) => {
    // Slopes −3, −0.5, 1/3, 2, 2, 2 (N = 6, K = 1): ½[S(4) + S(5)] = 2; CI ranks fall outside 1..N.
    const fit = passingBablok([1, 2, 3, 4], [4, 1, 3, 5], 0.95, slopeOrder([1, 2, 3, 4], [4, 1, 3, 5], options));
    expect([fit.slope, fit.slopeCount, fit.belowMinusOne, fit.slopeCi]).toEqual([2, 6, 1, null]);
  });

  it.each(modes)('leaves out a slope of exactly −1 and puts equal x at +∞ (%j)', (options) => {
    // Pairs in x-then-y order: (0,0)-(1,−1) is −1 (left out); (0,0)-(2,5) 2.5; (0,0)-(2,7) 3.5;
    // (1,−1)-(2,5) 6; (1,−1)-(2,7) 8; (2,5)-(2,7) equal x, +∞. N = 5, K = 0, median S(3) = 6.
    const x = [0, 1, 2, 2];
    const y = [0, -1, 5, 7];
    const order = slopeOrder(x, y, options);
    expect(order.weigh(null)).toEqual({ total: 5, below: 0 });
    expect([1, 2, 3, 4, 5, 6].map((r) => order.at(r))).toEqual([2.5, 3.5, 6, 8, Infinity, NaN]);
    expect(passingBablok(x, y, 0.95, order).slope).toBe(6);
  });

  it.each(modes)('keeps the sign of a zero slope as the table orders it (%j)', (options) => {
    // y = 0, −0, −0: pairs (0,1) −0 − 0 = −0, (0,2) −0, (1,2) −0 − (−0) = +0; the middle one is −0.
    const fit = passingBablok([1, 2, 3], [0, -0, -0], 0.95, slopeOrder([1, 2, 3], [0, -0, -0], options));
    expect(Object.is(fit.slope, -0)).toBe(true);
    const plus = passingBablok([1, 2, 3], [-0, 0, 0], 0.95, slopeOrder([1, 2, 3], [-0, 0, 0], options));
    expect(Object.is(plus.slope, 0)).toBe(true);
  });

  it.each(modes)('reads weighted ranks: a resample counts the pair (i, j) c_i·c_j times (%j)', (options) => {
    // Rows 0..3 on y = x except row 3 (slope 3 to row 0). Counts 2, 1, 0, 1: pairs (0,1) ×2 slope 1,
    // (0,3) ×2 slope 3, (1,3) ×1 slope 4; copies of row 0 are identical. N* = 5 (odd): S*(3) = 3.
    const x = [1, 2, 3, 4];
    const y = [1, 2, 3, 10];
    const order = slopeOrder(x, y, options);
    const counts = Int32Array.from([2, 1, 0, 1]);
    expect(order.weigh(counts)).toEqual({ total: 5, below: 0 });
    expect([1, 2, 3, 4, 5].map((r) => order.at(r))).toEqual([1, 1, 3, 3, 4]);
    expect(weightedPassingBablok(order, x, y, counts, new Float64Array(4)).slope).toBe(3);
  });
});

/** A double as m·2^e exactly (m a BigInt). */
function exactParts(v: number): [bigint, number] {
  if (v === 0) return [0n, 0];
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, v);
  const high = view.getUint32(0);
  const biased = (high >>> 20) & 0x7ff;
  let mantissa = (BigInt(high & 0xfffff) << 32n) | BigInt(view.getUint32(4));
  if (biased > 0) mantissa |= 1n << 52n;
  return [high >>> 31 ? -mantissa : mantissa, biased > 0 ? biased - 1075 : -1074];
}

/** Sign of (yp − t·xp) − (yq − t·xq) in exact integer arithmetic. */
function bigSign(yp: number, yq: number, xp: number, xq: number, t: number): number {
  const [mt, et] = exactParts(t);
  const terms = [exactParts(yp), exactParts(-yq), ...[[-xp], [xq]].map(([x]) => { const [m, e] = exactParts(x); return [m * mt, e + et] as [bigint, number]; })];
  const low = Math.min(...terms.map(([, e]) => e));
  const sum = terms.reduce((total, [m, e]) => total + (m << BigInt(e - low)), 0n);
  return sum > 0n ? 1 : sum < 0n ? -1 : 0;
}

describe('the exact key comparison of the general mode', () => {
  it('gives the sign that exact integer arithmetic gives, on near ties the doubles cannot decide', () => {
    const s = new Xor128('key-order');
    const wrong: string[] = [];
    let undecided = 0;
    for (let c = 0; c < 20000; c++) {
      const scale = 10 ** (s.nextIndex(41) - 20);
      const full = (): number => s.nextUniform() + s.nextUniform() * 2 ** -32;
      const xp = (full() - 0.5) * scale;
      const xq = c % 7 === 0 ? xp : (full() - 0.5) * scale;
      const t = c % 5 === 0 ? 2 : (full() - 0.5) * 10 ** (s.nextIndex(11) - 5);
      const yq = (full() - 0.5) * scale * Math.abs(t);
      // yp on the line through (xq, yq) with slope t, give or take a few units in the last place.
      let yp = yq + t * (xp - xq);
      for (let k = s.nextIndex(5) - 2; k !== 0; k += k > 0 ? -1 : 1) yp = k > 0 ? yp + Math.abs(yp) * 2 ** -52 : yp - Math.abs(yp) * 2 ** -52;
      const expected = bigSign(yp, yq, xp, xq, t);
      const naive = Math.sign(yp - t * xp - (yq - t * xq));
      if (naive !== expected) undecided++;
      if (keyOrder(yp, yq, xp, xq, t) !== expected || exactSign(yp, yq, xp, xq, t) !== expected) wrong.push(`${yp} ${yq} ${xp} ${xq} ${t}: ${expected}`);
    }
    expect(wrong.slice(0, 5)).toEqual([]);
    // Cases where plain doubles get the sign wrong are common here, so the exact path is what passed.
    expect(undecided).toBeGreaterThan(1000);
  });

  it('and where Δy matches t·Δx to about 106 bits (yp, −yq the two parts of t·Δx)', () => {
    const s = new Xor128('key-order-deep');
    const full = (): number => s.nextUniform() + s.nextUniform() * 2 ** -32; // all 53 bits in use
    const wrong: string[] = [];
    for (let c = 0; c < 20000; c++) {
      const xp = (full() + 0.5) * 2 ** (s.nextIndex(40) - 20);
      const xq = -(full() + 0.5) * 2 ** (s.nextIndex(40) - 20);
      const t = (full() - 0.5) * 2 ** (s.nextIndex(20) - 10);
      // t·(xp − xq) exactly, as m·2^e, then split into the nearest double and the nearest double of the rest.
      const [mt, et] = exactParts(t);
      const [ma, ea] = exactParts(xp);
      const [mb, eb] = exactParts(xq);
      const low = Math.min(ea, eb);
      const m = mt * ((ma << BigInt(ea - low)) - (mb << BigInt(eb - low)));
      const e = et + low;
      const high = Number(m) * 2 ** e;
      const [mh, eh] = exactParts(high);
      const lowest = Math.min(eh, e);
      let yq = -(Number((m << BigInt(e - lowest)) - (mh << BigInt(eh - lowest))) * 2 ** lowest);
      const nudge = s.nextIndex(3) - 1;
      if (nudge !== 0 && yq !== 0) yq += nudge * Math.abs(yq) * 2 ** -52;
      const expected = bigSign(high, yq, xp, xq, t);
      if (keyOrder(high, yq, xp, xq, t) !== expected) wrong.push(`${high} ${yq} ${xp} ${xq} ${t}: ${expected}`);
    }
    expect(wrong.slice(0, 5)).toEqual([]);
  });
});
