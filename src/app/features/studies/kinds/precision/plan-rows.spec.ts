import { PrecisionSettings } from '@shared/kinds/precision/meta';
import { StudySettings, type Study } from '@shared/schemas';
import { planRows } from '../plan-rows';
import { PRECISION_RULES } from './guidance';

const LEVEL_1 = { name: 'Level 1', claimRepeatability: 0.12, claimWithinLab: 0.2, claimAs: 'sd' as const, assignedValue: 5.2, assignedUncertainty: 0.05, assignedSource: 'certificate, lot C-88' };
const LEVEL_2 = { name: 'Level 2', claimRepeatability: 1.5, claimWithinLab: 2.5, claimAs: 'cv' as const, assignedValue: null, assignedUncertainty: null, assignedSource: '' };

function study(own: Partial<PrecisionSettings>, n: number, common: Partial<StudySettings> = {}) {
  const settings = { ...StudySettings.parse({ unit: 'mmol/L', ...PRECISION_RULES, ...common }), ...PrecisionSettings.parse(own) };
  return { kind: 'precision', n, analyteUnit: 'mmol/L', settings } as Pick<Study, 'kind' | 'n' | 'settings' | 'analyteUnit'>;
}
const find = (rows: ReturnType<typeof planRows>, label: string) => rows.find((r) => r.label === label);

describe('the plan of a precision verification', () => {
  it('lists each material with its claims as SDs in the unit or CVs in %, and its assigned value', () => {
    const rows = planRows(study({ materials: [LEVEL_1, LEVEL_2] }, 50, { reagentLot: 'R-12' }));
    expect(find(rows, 'Material 1: Level 1')?.value).toBe(
      'Repeatability SD ≤ 0.12 mmol/L, within-laboratory SD ≤ 0.2 mmol/L; assigned value 5.2 mmol/L (standard uncertainty 0.05 mmol/L), from certificate, lot C-88',
    );
    expect(find(rows, 'Material 2: Level 2')?.value).toBe('Repeatability CV ≤ 1.5 %, within-laboratory CV ≤ 2.5 %');
    expect(find(rows, 'Results')).toEqual({ label: 'Results', value: '5 days × 5 replicates per material: 50 planned for 2 materials; 50 included', missing: false });
    expect(find(rows, 'Significance level')?.value).toBe('α = 0.05; each upper verification limit at α/2 = 0.025 (2 materials)');
    expect(find(rows, 'Outlier rule')?.value).toBe(PRECISION_RULES.outlierRule);
    expect(find(rows, 'Acceptance rule')?.value).toMatch(/^Each SD within its claim, or within the upper verification limit/);
    expect(find(rows, 'Lots')?.value).toBe('reagent lot R-12');
    expect(rows.some((r) => r.label === 'Bootstrap')).toBe(false);
    expect(rows.filter((r) => r.missing)).toEqual([]);
  });

  it('follows the planned days and replicates, and marks fewer results than planned', () => {
    const rows = planRows(study({ materials: [LEVEL_1], days: 3, replicates: 4, alpha: 0.01, controlLot: 'QC-7' }, 10));
    expect(find(rows, 'Results')).toEqual({ label: 'Results', value: '3 days × 4 replicates per material: 12 planned for 1 material; 10 included', missing: true });
    expect(find(rows, 'Significance level')?.value).toBe('α = 0.01');
    expect(find(rows, 'Lots')?.value).toBe('control lot QC-7');
  });

  it('marks a plan without materials, and says the acceptance rule when the study left it empty', () => {
    const rows = planRows(study({}, 0, { acceptanceRule: '' }));
    expect(find(rows, 'Materials')).toEqual({ label: 'Materials', value: 'None named', missing: true });
    expect(find(rows, 'Acceptance rule')?.value).toBe(PRECISION_RULES.acceptanceRule);
    expect(find(rows, 'Lots')?.value).toBe('Not given');
  });
});
