import { planTable, powerCurves } from './plan-figures-data';
import { hopelessPlan, recommendingPlan } from './plan-results.testing';

describe('the figures of a plan run', () => {
  it('draws one curve per truth and decision level, told apart by dash and point shape, with the two targets as lines', () => {
    const result = { ...recommendingPlan() };
    const twoLevels = { ...result, settings: { ...result.settings, decisionLevels: [7, 11.1] }, rows: result.rows.map((r) => ({ ...r, levels: [r.levels[0], { ...r.levels[0], level: 11.1 }] })) };
    const curves = powerCurves(twoLevels, 'mmol/L');
    expect(curves.series).toHaveLength(6);
    const looks = curves.series.map((s) => `${s.dash.join('-')}|${s.marker}`);
    expect(new Set(looks).size).toBe(6);
    expect(curves.series[0].label).toBe('At 7.00 mmol/L, true bias half the allowable bias (power)');
    expect(curves.series[0].points).toEqual(result.rows.map((r) => ({ x: r.n, y: r.levels[0].powerAtHalf })));
    expect(curves.series[2].points).toEqual(result.rows.map((r) => ({ x: r.n, y: r.levels[0].falsePass })));
    expect(curves.lines.map((l) => [l.value, l.label])).toEqual([[0.8, 'Target power 80%'], [0.05, 'Most false passes accepted 5%']]);
    expect([curves.yMin, curves.yMax]).toEqual([0, 1]);
  });

  it('writes a line per n and level, marks the recommended n and names the targets each line misses', () => {
    const good = recommendingPlan();
    const rows = planTable(good, 'mmol/L');
    expect(rows.map((r) => [r.n, r.first, r.recommended])).toEqual(good.rows.map((r) => [r.n, true, r.n === good.recommendedN]));
    const bad = planTable(hopelessPlan(), 'mmol/L');
    expect(bad.every((r) => r.misses.includes('power below target'))).toBe(true);
    expect(bad[0].powerAtHalf).toMatch(/^\d+\.\d%$/);
    expect(bad[0].allowable).toBe('±0.070');
  });
});
