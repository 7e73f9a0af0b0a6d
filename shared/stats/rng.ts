import seedrandom from 'seedrandom';

/**
 * Seeded uniform stream: seedrandom's xor4096 generator (R. P. Brent, "Some long-period random number
 * generators using shifts and xors", ANZIAM J. 48 (2007) C188-C202; implementation of seedrandom 3.0.5).
 * seedrandom seeds the 4096-bit state from the string; the draws are then produced here by the same
 * recurrence over an Int32Array, so the hot resampling loops run without a closure call per draw.
 * rng.spec.ts proves the stream equals seedrandom.xor4096(seed).int32() draw for draw.
 *
 * Draw order (fixed): each call of nextIndex(n) takes the next 32-bit output v and returns
 * floor((v >>> 0) · n / 2^32), which equals Math.floor(seedrandom.xor4096(seed)() · n).
 */
export class Xor4096 {
  private readonly X: Int32Array;
  private w: number;
  private i: number;

  constructor(seed: string) {
    const state = seedrandom.xor4096(seed, { state: true }).state();
    this.X = Int32Array.from(state.X);
    this.w = state.w | 0;
    this.i = state.i | 0;
  }

  /** The next output as a signed 32-bit integer (seedrandom's int32()). */
  nextInt32(): number {
    const X = this.X;
    const w = (this.w = (this.w + 0x61c88647) | 0);
    let v = X[(this.i + 34) & 127];
    const i = (this.i = (this.i + 1) & 127);
    let t = X[i];
    v ^= v << 13;
    t ^= t << 17;
    v ^= v >>> 15;
    t ^= t >>> 12;
    v = X[i] = v ^ t;
    return (v + (w ^ (w >>> 16))) | 0;
  }

  /** A uniform in [0, 1) with 32-bit resolution (seedrandom's prng()). */
  nextUniform(): number {
    return (this.nextInt32() >>> 0) / 4294967296;
  }

  /** A uniform index in 0..n-1: floor(u · n). */
  nextIndex(n: number): number {
    return ((this.nextInt32() >>> 0) * n / 4294967296) | 0;
  }

  /**
   * One bootstrap resample as counts: zero counts[0..n), then n draws, each adding one to counts[floor(u·n)].
   * The recurrence is inlined (same as nextInt32) because this loop carries nearly all the engine's work.
   */
  fillCounts(counts: Int32Array, n: number): void {
    counts.fill(0, 0, n);
    const X = this.X;
    let w = this.w;
    let i = this.i;
    const scale = n * 2.3283064365386963e-10; // n / 2^32, exact: multiplying by 2^-32 equals dividing by 2^32
    for (let draw = 0; draw < n; draw++) {
      w = (w + 0x61c88647) | 0;
      let v = X[(i + 34) & 127];
      i = (i + 1) & 127;
      let t = X[i];
      v ^= v << 13;
      t ^= t << 17;
      v ^= v >>> 15;
      t ^= t >>> 12;
      v = X[i] = v ^ t;
      counts[(((v + (w ^ (w >>> 16))) >>> 0) * scale) | 0]++;
    }
    this.w = w;
    this.i = i;
  }

  /** n draws of floor(u·n) written in draw order into out[0..n). */
  fillIndices(out: Int32Array, n: number): void {
    for (let draw = 0; draw < n; draw++) out[draw] = this.nextIndex(n);
  }
}

/**
 * The stream for one part of an analysis: seeded with `${seed}:${part}` so that each part
 * (for example 'differences', 'null-median', 'regression') is reproducible on its own and does not
 * change when another part's resample count changes.
 */
export function streamFor(seed: string, part: string): Xor4096 {
  return new Xor4096(`${seed}:${part}`);
}
