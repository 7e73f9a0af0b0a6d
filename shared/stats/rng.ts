import seedrandom from 'seedrandom';

/**
 * Seeded uniform stream: seedrandom's xor128 generator (G. Marsaglia, "Xorshift RNGs", Journal of
 * Statistical Software 8(14), 2003; implementation of seedrandom 3.0.5). seedrandom seeds the 128-bit
 * state from the string; the draws are then produced here by the same recurrence held in local
 * variables, so the hot resampling loop runs without a closure call or memory access per draw.
 * xor128 was chosen over seedrandom's xor4096 because it is about 2.5 times faster in that loop
 * (npm run bench); its period 2^128 - 1 is ample for resampling.
 * rng.spec.ts proves the stream equals seedrandom.xor128(seed).int32() draw for draw.
 *
 * Draw order (fixed): each call of nextIndex(n) takes the next 32-bit output v and returns
 * floor((v >>> 0) · n / 2^32), which equals Math.floor(seedrandom.xor128(seed)() · n).
 */
export class Xor128 {
  private x: number;
  private y: number;
  private z: number;
  private w: number;

  constructor(seed: string) {
    const state = (seedrandom.xor128(seed, { state: true }) as unknown as { state: () => { x: number; y: number; z: number; w: number } }).state();
    this.x = state.x | 0;
    this.y = state.y | 0;
    this.z = state.z | 0;
    this.w = state.w | 0;
  }

  /** The current state (x, y, z, w) as unsigned 32-bit words, e.g. to start another implementation at the same draw. */
  stateWords(): [number, number, number, number] {
    return [this.x >>> 0, this.y >>> 0, this.z >>> 0, this.w >>> 0];
  }

  /** The next output as a signed 32-bit integer (seedrandom's int32()). */
  nextInt32(): number {
    const t = this.x ^ (this.x << 11);
    this.x = this.y;
    this.y = this.z;
    this.z = this.w;
    this.w = this.w ^ (this.w >>> 19) ^ t ^ (t >>> 8);
    return this.w;
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
   * Written for V8's optimiser, with the draws unchanged: the state is read with `| 0` (the fields are class
   * fields, first undefined, so without it the loop variables are not kept as int32 and every draw converts),
   * and four draws are made per pass, each new output written over the oldest word, so no variable is copied
   * into another from draw to draw (the shuffle x = y, y = z, z = w is left to the last n mod 4 draws).
   */
  fillCounts(counts: Int32Array, n: number): void {
    counts.fill(0, 0, n);
    let x = this.x | 0;
    let y = this.y | 0;
    let z = this.z | 0;
    let w = this.w | 0;
    const scale = n * 2.3283064365386963e-10; // n / 2^32, exact: multiplying by 2^-32 equals dividing by 2^32
    let left = n;
    for (; left >= 4; left -= 4) {
      let t = x ^ (x << 11);
      x = w ^ (w >>> 19) ^ t ^ (t >>> 8);
      counts[((x >>> 0) * scale) | 0]++;
      t = y ^ (y << 11);
      y = x ^ (x >>> 19) ^ t ^ (t >>> 8);
      counts[((y >>> 0) * scale) | 0]++;
      t = z ^ (z << 11);
      z = y ^ (y >>> 19) ^ t ^ (t >>> 8);
      counts[((z >>> 0) * scale) | 0]++;
      t = w ^ (w << 11);
      w = z ^ (z >>> 19) ^ t ^ (t >>> 8);
      counts[((w >>> 0) * scale) | 0]++;
    }
    for (; left > 0; left--) {
      const t = x ^ (x << 11);
      x = y;
      y = z;
      z = w;
      w = w ^ (w >>> 19) ^ t ^ (t >>> 8);
      counts[((w >>> 0) * scale) | 0]++;
    }
    this.x = x;
    this.y = y;
    this.z = z;
    this.w = w;
  }

  /**
   * fillCounts (the same draws, the same counts), and returns how many of the n draws have u >= 1/2 (the top
   * bit of the output set). For even n those are exactly the draws at positions n/2 .. n − 1, so the caller
   * knows counts[0] + … + counts[n/2 − 1] without summing them (medianReplicates in bootstrap.ts).
   * The loop is fillCounts's with one shift and add per draw; kept separate so that fillCounts does not pay for it.
   */
  fillCountsUpperHalf(counts: Int32Array, n: number): number {
    counts.fill(0, 0, n);
    let x = this.x | 0;
    let y = this.y | 0;
    let z = this.z | 0;
    let w = this.w | 0;
    const scale = n * 2.3283064365386963e-10;
    let upper = 0;
    let left = n;
    for (; left >= 4; left -= 4) {
      let t = x ^ (x << 11);
      x = w ^ (w >>> 19) ^ t ^ (t >>> 8);
      counts[((x >>> 0) * scale) | 0]++;
      t = y ^ (y << 11);
      y = x ^ (x >>> 19) ^ t ^ (t >>> 8);
      counts[((y >>> 0) * scale) | 0]++;
      t = z ^ (z << 11);
      z = y ^ (y >>> 19) ^ t ^ (t >>> 8);
      counts[((z >>> 0) * scale) | 0]++;
      t = w ^ (w << 11);
      w = z ^ (z >>> 19) ^ t ^ (t >>> 8);
      counts[((w >>> 0) * scale) | 0]++;
      upper += (x >>> 31) + (y >>> 31) + (z >>> 31) + (w >>> 31);
    }
    for (; left > 0; left--) {
      const t = x ^ (x << 11);
      x = y;
      y = z;
      z = w;
      w = w ^ (w >>> 19) ^ t ^ (t >>> 8);
      counts[((w >>> 0) * scale) | 0]++;
      upper += w >>> 31;
    }
    this.x = x;
    this.y = y;
    this.z = z;
    this.w = w;
    return upper;
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
export function streamFor(seed: string, part: string): Xor128 {
  return new Xor128(`${seed}:${part}`);
}
