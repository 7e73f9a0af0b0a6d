import seedrandom from 'seedrandom';
import { Xor128, streamFor } from './rng';

describe('Xor128', () => {
  it('gives the same 32-bit outputs as seedrandom.xor128 for the same seed', () => {
    const reference = seedrandom.xor128('parallax');
    const stream = new Xor128('parallax');
    for (let k = 0; k < 5000; k++) expect(stream.nextInt32()).toBe(reference.int32());
  });

  it('draws indices as Math.floor(seedrandom.xor128(seed)() * n)', () => {
    const reference = seedrandom.xor128('seed-7');
    const stream = new Xor128('seed-7');
    for (let k = 0; k < 2000; k++) expect(stream.nextIndex(37)).toBe(Math.floor(reference() * 37));
  });

  it('fills counts with the same draws as single index calls', () => {
    const a = new Xor128('s');
    const b = new Xor128('s');
    const counts = new Int32Array(25);
    for (let rep = 0; rep < 3; rep++) {
      a.fillCounts(counts, 25);
      const expected = new Int32Array(25);
      for (let k = 0; k < 25; k++) expected[b.nextIndex(25)]++;
      expect(Array.from(counts)).toEqual(Array.from(expected));
    }
    expect(a.nextInt32()).toBe(b.nextInt32());
  });

  it('gives each part of an analysis its own stream', () => {
    expect(streamFor('1', 'a').nextInt32()).not.toBe(streamFor('1', 'b').nextInt32());
    expect(streamFor('1', 'a').nextInt32()).toBe(streamFor('1', 'a').nextInt32());
  });
});
