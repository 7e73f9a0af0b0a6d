import { precisionResult } from '@shared/kinds/precision/words-fixture';
import { asPrecision, precisionFormat } from './precision-result';

describe('precision results on the Findings panel', () => {
  it('takes the unit and the decimals from the study (the analyte’s unit when the study sets none)', () => {
    expect(precisionFormat({ settings: { decimals: 2, unit: 'mmol/L' }, analyteUnit: 'g/L' } as never)).toEqual({ unit: 'mmol/L', value: 2, stat: 3, percent: 1 });
    expect(precisionFormat({ settings: { decimals: 0, unit: '' }, analyteUnit: 'U/L' } as never)).toEqual({ unit: 'U/L', value: 0, stat: 1, percent: 1 });
    expect(precisionFormat({ settings: { decimals: 1, unit: '' }, analyteUnit: null } as never).unit).toBe('');
  });

  it('reads precision results and refuses results of another kind', () => {
    const r = precisionResult();
    expect(asPrecision(r)).toBe(r);
    expect(asPrecision({ kind: 'interval', materials: [] })).toBeNull();
    expect(asPrecision({ kind: 'precision' })).toBeNull();
    expect(asPrecision(null)).toBeNull();
  });
});
