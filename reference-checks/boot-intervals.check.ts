import { bcaInterval, percentileInterval } from '@shared/stats/confidence-interval';
import { jackknifeMoments, jackknifeQuantileSorted } from '@shared/stats/jackknife';
import { mean, median } from '@shared/stats';
import { fixture } from './support';

// Source: R 4.2 with the boot package 1.3-28 (A. Canty and B. Ripley; Davison & Hinkley 1997), run once by
// make-fixtures/make_boot_fixture.R on invented data: boot(x, statistic, R = 1999), then
// boot.ci(type = c("perc", "bca"), L = empinf(b, type = "jack")). The fixture keeps boot's own replicates,
// so the same replicates go through Parallax's interval code: percentile and BCa (bias correction from the
// replicates strictly below t0, jackknife acceleration, boot's norm.inter interpolation) must agree to 1e-9.
const boot = fixture('boot.json');

describe("percentile and BCa intervals against R's boot", () => {
  const cases = [
    ['mean', mean, () => jackknifeMoments(boot.data).mean],
    ['median', median, () => jackknifeQuantileSorted(Float64Array.from(boot.data).sort(), 0.5)],
  ] as const;

  it.each(cases)('%s: the estimate equals boot\'s t0', (name, statistic) => {
    expect(statistic(boot.data)).toBeCloseTo(boot[name].t0, 12);
  });

  it.each(cases)("%s: percentile interval as boot.ci type 'perc'", (name) => {
    const ci = percentileInterval(Float64Array.from(boot[name].t).sort(), boot.level);
    expect(ci[0]).toBeCloseTo(boot[name].percentile[0], 9);
    expect(ci[1]).toBeCloseTo(boot[name].percentile[1], 9);
  });

  it.each(cases)("%s: BCa interval as boot.ci type 'bca' with jackknife influence values", (name, statistic, jack) => {
    const ci = bcaInterval(Float64Array.from(boot[name].t).sort(), statistic(boot.data), jack(), boot.level)!;
    expect(ci[0]).toBeCloseTo(boot[name].bca[0], 9);
    expect(ci[1]).toBeCloseTo(boot[name].bca[1], 9);
  });
});
