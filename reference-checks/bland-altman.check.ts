import { analyzeComparison } from '@shared/stats';
import { dataFile } from './support';

// Source: J. M. Bland and D. G. Altman (1986), "Statistical methods for assessing agreement between two
// methods of clinical measurement", Lancet 327(8476), 307–310, Table 1 (peak expiratory flow, first reading
// on each meter, 17 subjects); copied into reference-checks/data/bland-altman-1986-pefr.csv.
// Printed values (from memory of the paper, as recorded in the reference data's README): mean difference
// (large meter − mini meter) −2.1 l/min, SD 38.8, limits of agreement mean ± 2 SD = −79.7 to 75.5.
// Exact values of the data: mean −36/17, SD 38.7651298736 (recomputed). The paper used k = 2.
function rows(): { x: number; y: number }[] {
  return dataFile('bland-altman-1986-pefr.csv').trim().split('\n').slice(1).map((line) => {
    const [, meter1, meter2] = line.split(',').map(Number);
    return { x: meter2, y: meter1 }; // d = y − x = meter1 − meter2, the paper's direction
  });
}

describe('Bland & Altman (1986) peak-flow data', () => {
  const result = analyzeComparison(rows(), { loaMultiplier: 2, resamples: 2000 });

  it('reproduces the printed mean difference −2.1 and SD 38.8 (Bland & Altman 1986, memory of the paper)', () => {
    expect(result.n).toBe(17);
    expect(Number(result.bias.mean.estimate!.toFixed(1))).toBe(-2.1);
    expect(Number(result.sd.estimate!.toFixed(1))).toBe(38.8);
  });

  it('matches the exact mean −36/17 and SD 38.7651298736 of the data (recomputed)', () => {
    expect(result.bias.mean.estimate).toBeCloseTo(-36 / 17, 12);
    expect(result.sd.estimate).toBeCloseTo(38.7651298736, 9);
  });

  it('gives limits of agreement that round to the printed −79.7 and 75.5 from the rounded mean and SD (Bland & Altman 1986)', () => {
    const lower = result.limitsOfAgreement.lower.estimate!;
    const upper = result.limitsOfAgreement.upper.estimate!;
    expect(lower).toBeCloseTo(-36 / 17 - 2 * 38.7651298736, 8);
    expect(upper).toBeCloseTo(-36 / 17 + 2 * 38.7651298736, 8);
    expect(Math.abs(lower - -79.7)).toBeLessThan(0.1);
    expect(Math.abs(upper - 75.5)).toBeLessThan(0.1);
  });
});
