import { RangeSettings } from '@shared/kinds/reportable-range/meta';
import { StudySettings, type Study } from '@shared/schemas';
import { planRows } from '../plan-rows';
import { RANGE_RULES } from './guidance';

const FRACTIONS = [0, 0.25, 0.5, 0.75, 1].map((fraction, i) => ({ name: `Level ${i + 1}`, assigned: null, fraction }));
const MIXED = [
  { name: 'Low', assigned: 2, fraction: null }, { name: 'Level 2', assigned: null, fraction: 0.25 }, { name: 'Level 3', assigned: null, fraction: 0.5 },
  { name: 'Level 4', assigned: null, fraction: 0.75 }, { name: 'High', assigned: 32.5, fraction: null },
];

function study(own: Partial<RangeSettings>, n: number, common: Partial<StudySettings> = {}) {
  const settings = { ...StudySettings.parse({ unit: 'mmol/L', seed: 'abc123', ...RANGE_RULES, ...common }), ...RangeSettings.parse(own) };
  return { kind: 'reportable-range', n, analyteUnit: 'mmol/L', settings } as Pick<Study, 'kind' | 'n' | 'settings' | 'analyteUnit'>;
}
const find = (rows: ReturnType<typeof planRows>, label: string) => rows.find((r) => r.label === label);

describe('the plan of a reportable-range study', () => {
  it('lists the levels with their values, the pools, the design, goal with source, claim, α and the bootstrap', () => {
    const rows = planRows(study({
      levels: MIXED, poolLow: 2, poolHigh: 32, replicates: 3, allowableNonlinearity: 0.3, allowableNonlinearityPercent: 2,
      nonlinearitySource: 'Half the allowable bias (lab policy)', claimedLow: 2, claimedHigh: 32, alpha: 0.01,
    }, 15, { reagentLot: 'R-12' }));
    expect(rows.map((r) => r.label)).toEqual([
      'Levels', 'Level 1: Low', 'Level 2', 'Level 3', 'Level 4', 'Level 5: High', 'Pools', 'Results', 'Allowable nonlinearity',
      'Source of the allowable nonlinearity', 'Claimed measuring interval', 'Significance level', 'Bootstrap', 'Outlier rule', 'Acceptance rule', 'Lots',
    ]);
    expect(find(rows, 'Levels')?.value).toBe('5 levels, as assigned values and fractions of the high pool');
    expect(find(rows, 'Level 1: Low')?.value).toBe('Assigned value 2 mmol/L');
    expect(find(rows, 'Level 2')?.value).toBe('Fraction 0.25 of the high pool (9.5 mmol/L from the pools)');
    expect(find(rows, 'Pools')?.value).toBe('Low 2 mmol/L, high 32 mmol/L');
    expect(find(rows, 'Results')).toEqual({ label: 'Results', value: '3 replicates per level: 15 planned for 5 levels; 15 included', missing: false });
    expect(find(rows, 'Allowable nonlinearity')?.value).toBe('±0.3 mmol/L or ±2 % of the level, whichever is greater');
    expect(find(rows, 'Source of the allowable nonlinearity')?.value).toBe('Half the allowable bias (lab policy)');
    expect(find(rows, 'Claimed measuring interval')?.value).toBe('2 to 32 mmol/L');
    expect(find(rows, 'Significance level')?.value).toBe("α = 0.01, for the t-test of each polynomial's top coefficient");
    expect(find(rows, 'Bootstrap')?.value).toBe('10,000 resamples of the replicates within each level, percentile 95% CIs of the deviations, seed abc123');
    expect(find(rows, 'Acceptance rule')?.value).toBe(RANGE_RULES.acceptanceRule);
    expect(find(rows, 'Lots')?.value).toBe('reagent lot R-12');
    expect(rows.filter((r) => r.missing)).toEqual([]);
  });

  it('marks what sign-off needs and the plan lacks: levels, goal, claim, results', () => {
    const rows = planRows(study({ levels: FRACTIONS.slice(0, 4), allowableNonlinearityPercent: 5 }, 6, { resamples: 5000, confidenceLevel: 0.9 }));
    expect(find(rows, 'Levels')).toEqual({ label: 'Levels', value: '4 levels, as fractions of the high pool; at least 5 are needed', missing: true });
    expect(find(rows, 'Level 1')?.value).toBe('Fraction 0 of the high pool');
    expect(find(rows, 'Pools')?.value).toBe('Not given: the findings are drawn against the fraction, without recovery');
    expect(find(rows, 'Results')).toEqual({ label: 'Results', value: '2 replicates per level: 8 planned for 4 levels; 6 included', missing: true });
    expect(find(rows, 'Allowable nonlinearity')).toEqual({ label: 'Allowable nonlinearity', value: '±5 % of the level', missing: false });
    expect(find(rows, 'Source of the allowable nonlinearity')?.value).toBe('Not given');
    expect(find(rows, 'Claimed measuring interval')).toEqual({ label: 'Claimed measuring interval', value: 'Not given', missing: true });
    expect(find(rows, 'Bootstrap')?.value).toMatch(/^5,000 resamples .* percentile 90% CIs/);

    const none = planRows(study({}, 0, { acceptanceRule: '' }));
    expect(find(none, 'Levels')).toEqual({ label: 'Levels', value: 'None named', missing: true });
    expect(find(none, 'Allowable nonlinearity')).toEqual({ label: 'Allowable nonlinearity', value: 'Not set: no verdict can be given', missing: true });
    expect(find(none, 'Acceptance rule')?.value).toBe(RANGE_RULES.acceptanceRule);
    expect(none.some((r) => r.label === 'Pools')).toBe(false);
  });
});
