import { dueRuleArray, dueRuleGroup, dueRulesOf, keyFrom, requirementArray, requirementGroup, requirementsOf } from './requirement-form';

describe('keyFrom', () => {
  it('makes a key the API accepts from a label', () => {
    expect(keyFrom('Method comparison', new Set())).toBe('method-comparison');
    expect(keyFrom('  Précision (5 × 5) ', new Set())).toBe('precision-5-5');
    expect(keyFrom('2nd lot check', new Set(), 'requirement')).toBe('requirement-2nd-lot-check');
    expect(keyFrom('***', new Set(), 'due')).toBe('due');
    expect(keyFrom('x'.repeat(80), new Set())).toHaveLength(40);
  });

  it('never repeats a key already taken', () => {
    expect(keyFrom('Precision', new Set(['precision', 'precision-2']))).toBe('precision-3');
    const long = 'a'.repeat(40);
    const key = keyFrom(long, new Set([long]));
    expect(key).toHaveLength(40);
    expect(key.endsWith('-2')).toBe(true);
  });
});

describe('requirementsOf', () => {
  it('keeps existing keys, gives new rows their own, and trims the words', () => {
    const rows = requirementArray([{ key: 'comparison', label: 'Comparison', kinds: ['method-comparison'], rule: '' }]);
    rows.push(requirementGroup({ label: ' Comparison ', kinds: ['method-comparison'], rule: ' 40 specimens ' }));
    expect(requirementsOf(rows)).toEqual([
      { key: 'comparison', label: 'Comparison', kinds: ['method-comparison'], rule: '' },
      { key: 'comparison-2', label: 'Comparison', kinds: ['method-comparison'], rule: '40 specimens' },
    ]);
  });

  it('checks each field with the API’s own rule', () => {
    const row = requirementGroup();
    expect(row.controls.label.errors).toEqual({ rule: 'Give the requirement a name' });
    expect(row.controls.kinds.errors).toEqual({ rule: 'Name at least one kind of study that meets it' });
    row.patchValue({ label: 'Precision', kinds: ['precision'] });
    expect(row.valid).toBe(true);
  });
});

describe('dueRulesOf', () => {
  it('sends the months as a number and refuses a month count out of range', () => {
    const rows = dueRuleArray([]);
    rows.push(dueRuleGroup({ label: 'Yearly comparison', months: 12 }));
    expect(dueRulesOf(rows)).toEqual([{ key: 'yearly-comparison', label: 'Yearly comparison', months: 12, rule: '', kinds: [] }]);
    rows.at(0).controls.kinds.setValue(['method-comparison']);
    expect(dueRulesOf(rows)[0].kinds).toEqual(['method-comparison']);
    rows.at(0).controls.months.setValue(61);
    expect(rows.at(0).controls.months.errors).toEqual({ rule: 'At most 60 months' });
    rows.at(0).controls.months.setValue(null);
    expect(rows.at(0).controls.months.errors).toEqual({ rule: 'Months must be a number' });
  });
});
