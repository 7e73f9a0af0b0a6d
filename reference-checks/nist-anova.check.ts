import { analyzePrecision } from '@shared/stats';
import { oneWayAnova } from '@shared/stats/one-way-anova';
import { dataFile, logRelativeError } from './support';

// Source: NIST Statistical Reference Datasets, one-way analysis of variance (certified with multiple-precision
// arithmetic, given to 15 significant digits): SiRstv (Ehrstein & Croarkin, 5 instruments × 5 results, the
// 5 × 5 shape of a precision study), AtmWtAg (Powell, Murphy & Gramlich 1982, 2 × 24), SmLs01, SmLs04, SmLs07
// (9 × 21, the same data shifted by 10^6 and 10^12). Files copied, with NIST's headers, from the project's
// shared reference data into reference-checks/data/nist-strd-anova/ (provenance in README.md).
// Tolerance: at least 14 of the 15 certified digits (NIST's log relative error, LRE ≥ 14) for sums of squares,
// mean squares, F, R² and the residual SD; degrees of freedom exactly. SmLs07 is the hard one: with values
// 10^12 + 0.x, the spread sits in the last 4 bits of each double.
interface NistAnova {
  groups: number[][];
  dfBetween: number; dfWithin: number;
  ssBetween: number; ssWithin: number;
  msBetween: number; msWithin: number;
  f: number; rSquared: number; residualSd: number;
}

function nistAnova(name: string): NistAnova {
  const text = dataFile('nist-strd-anova', `${name}.dat`);
  const between = /^Between \S+\s+(\d+)\s+(\S+)\s+(\S+)\s+(\S+)\s*$/m.exec(text)!;
  const within = /^Within \S+\s+(\d+)\s+(\S+)\s+(\S+)\s*$/m.exec(text)!;
  const lines = text.split(/\r?\n/);
  // the data block: the last "Data:" line (the header's "Data: 1 Factor" comes first)
  const start = lines.map((l, i) => (/^Data:\s+\S+\s+\S+\s*$/.test(l) ? i : -1)).reduce((a, b) => Math.max(a, b), -1);
  const groups = new Map<string, number[]>();
  for (const line of lines.slice(start + 1)) {
    const m = /^\s*(\d+)\s+(\S+)\s*$/.exec(line);
    if (!m) continue;
    if (!groups.has(m[1])) groups.set(m[1], []);
    groups.get(m[1])!.push(Number(m[2]));
  }
  return {
    groups: [...groups.values()],
    dfBetween: Number(between[1]), ssBetween: Number(between[2]), msBetween: Number(between[3]), f: Number(between[4]),
    dfWithin: Number(within[1]), ssWithin: Number(within[2]), msWithin: Number(within[3]),
    rSquared: Number(/Certified R-Squared\s+(\S+)/.exec(text)![1]),
    residualSd: Number(/Standard Deviation\s+(\S+)/.exec(text)![1]),
  };
}

const DATASETS = ['SiRstv', 'AtmWtAg', 'SmLs01', 'SmLs04', 'SmLs07'];

describe('NIST StRD one-way ANOVA: certified values', () => {
  it.each(DATASETS)('%s: df, sums of squares, mean squares, F, R² and residual SD to the certified digits (NIST StRD)', (name) => {
    const c = nistAnova(name);
    expect(c.groups.reduce((a, g) => a + g.length, 0)).toBe(c.dfBetween + c.dfWithin + 1);
    const a = oneWayAnova(c.groups);
    expect(a.dfBetween).toBe(c.dfBetween);
    expect(a.dfWithin).toBe(c.dfWithin);
    expect(logRelativeError(a.ssBetween, c.ssBetween)).toBeGreaterThanOrEqual(14);
    expect(logRelativeError(a.ssWithin, c.ssWithin)).toBeGreaterThanOrEqual(14);
    expect(logRelativeError(a.msBetween, c.msBetween)).toBeGreaterThanOrEqual(14);
    expect(logRelativeError(a.msWithin, c.msWithin)).toBeGreaterThanOrEqual(14);
    expect(logRelativeError(a.f, c.f)).toBeGreaterThanOrEqual(14);
    expect(logRelativeError(a.ssBetween / (a.ssBetween + a.ssWithin), c.rSquared)).toBeGreaterThanOrEqual(14);
    expect(logRelativeError(Math.sqrt(a.msWithin), c.residualSd)).toBeGreaterThanOrEqual(14);
    expect(a.balanced).toBe(true);
    expect(a.n0).toBe(c.groups[0].length);
  });

  it.each(['SiRstv', 'SmLs01', 'AtmWtAg'])('%s divided by 3 (no exact decimals: the binary path) keeps the certified mean squares (NIST StRD)', (name) => {
    const c = nistAnova(name);
    const a = oneWayAnova(c.groups.map((g) => g.map((v) => v / 3)));
    expect(logRelativeError(a.msBetween * 9, c.msBetween)).toBeGreaterThanOrEqual(name === 'AtmWtAg' ? 9 : 12);
    expect(logRelativeError(a.msWithin * 9, c.msWithin)).toBeGreaterThanOrEqual(name === 'AtmWtAg' ? 9 : 12);
  });

  it.each(['SiRstv', 'SmLs07'])('%s as a precision study (group = day): s_r is the certified residual SD, MS as certified (NIST StRD)', (name) => {
    const c = nistAnova(name);
    const rows = c.groups.flatMap((g, i) => g.map((value, j) => ({ material: 'M', day: String(i + 1), replicate: j + 1, value })));
    const result = analyzePrecision(rows, { materials: [{ name: 'M', claimRepeatability: 1, claimWithinLab: 1, claimAs: 'sd' }], days: c.groups.length, replicates: c.groups[0].length });
    const m = result.materials[0];
    expect(logRelativeError(m.repeatability.sd, c.residualSd)).toBeGreaterThanOrEqual(14);
    expect(logRelativeError(m.anova.msBetween, c.msBetween)).toBeGreaterThanOrEqual(14);
    expect(logRelativeError(m.anova.msWithin, c.msWithin)).toBeGreaterThanOrEqual(14);
    expect(m.repeatability.df).toBe(c.dfWithin);
  });
});
