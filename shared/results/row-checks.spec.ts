import { kindMeta } from '../kinds/kinds';
import type { RowField } from '../kinds/kind';
import { RESULT_CASES } from './result-cases.testing';
import {
  EXCLUDED_WITHOUT_REASON, emptyRequired, emptyRequiredWords, fieldProblem, isEmptyEntry, lacksReason, readField, type RowRules,
} from './row-checks';

const comparison = kindMeta('method-comparison').rowFields;
const candidate = comparison.find((f) => f.field === 'candidate')!;
const strict: RowRules = { canBeNegative: false, decimalMark: 'auto' };

describe('readField: results, the one rule both sides apply', () => {
  it.each(RESULT_CASES.map((c) => [JSON.stringify(c.input), c] as const))('%s', (_, c) => {
    expect(readField(candidate, c.input, strict)).toEqual(c.read ?? { error: c.error });
  });

  it('writes a refusal after the field\'s name', () => {
    const read = readField(candidate, '<0.5', strict);
    expect('error' in read && fieldProblem(candidate, read.error)).toBe(
      'candidate result "<0.5" is censored (below or above a limit); enter a number or leave it empty and exclude the row with a reason',
    );
  });

  it('keeps a negative result where the analyte may be negative, and reads "1,234" by the study\'s mark', () => {
    expect(readField(candidate, '-0.4', { canBeNegative: true, decimalMark: 'auto' })).toEqual({ value: -0.4, text: '-0.4' });
    expect(readField(candidate, '1,234', { canBeNegative: false, decimalMark: 'point' })).toEqual({ value: 1234, text: '1234' });
    expect(readField(candidate, '1,234', { canBeNegative: false, decimalMark: 'comma' })).toEqual({ value: 1.234, text: '1.234' });
  });

  it('reads a number given as a number (JSON, a spreadsheet cell) and refuses one that is not finite', () => {
    expect(readField(candidate, 4.2, strict)).toEqual({ value: 4.2, text: '4.2' });
    expect(readField(candidate, Number.NaN, strict)).toEqual({ error: 'is not a finite number' });
  });
});

describe('readField: the other field types', () => {
  const replicate: RowField = { field: 'replicate', type: 'integer', words: 'replicate' };
  const sex: RowField = { field: 'sex', type: 'sex', words: 'sex', column: 'sex', emptyIsNull: true };
  const label: RowField = { field: 'label', type: 'text', words: 'specimen label', column: 'label' };
  const material: RowField = { field: 'material', type: 'text', words: 'material', required: true };

  it.each([
    ['3', { value: 3, text: null }], [' 12 ', { value: 12, text: null }], ['', { value: null, text: null }], [null, { value: null, text: null }],
    ['0', { error: '"0" must be a whole number from 1' }], ['1.5', { error: '"1.5" must be a whole number from 1' }],
    ['1234567', { error: '"1234567" must be a whole number from 1' }], ['x', { error: '"x" must be a whole number from 1' }],
  ])('integer %j', (input, expected) => {
    expect(readField(replicate, input, strict)).toEqual(expected);
  });

  it.each([
    ['f', 'F'], ['Female', 'F'], ['w', 'F'], [' M ', 'M'], ['male', 'M'], ['', null], [null, null],
  ])('sex %j reads as %j', (input, expected) => {
    expect(readField(sex, input, strict)).toEqual({ value: expected, text: null });
  });

  it('refuses a sex other than F or M', () => {
    expect(readField(sex, 'x', strict)).toEqual({ error: 'must be F or M (or empty)' });
  });

  it('keeps text trimmed; empty text is null without a column or where the field says so, else ""', () => {
    expect(readField(label, '  S1 ', strict)).toEqual({ value: 'S1', text: null });
    expect(readField(label, ' ', strict)).toEqual({ value: '', text: null });
    expect(readField(sex, ' ', strict)).toEqual({ value: null, text: null });
    expect(readField(material, '', strict)).toEqual({ value: null, text: null });
  });
});

describe('empty fields and exclusions', () => {
  it('names the required fields an included row leaves empty, and none of an excluded row', () => {
    const row: Record<string, unknown> = { label: 'S1', comparative: '4.1', candidate: '  ' };
    expect(emptyRequired(comparison, (f) => row[f.field], false).map(emptyRequiredWords)).toEqual([
      'the candidate result is empty; fill it or exclude the row with a reason',
    ]);
    expect(emptyRequired(comparison, (f) => row[f.field], true)).toEqual([]);
    expect(emptyRequired(comparison, (f) => ({ label: '', comparative: 1, candidate: 0 })[f.field as 'label'], false)).toEqual([]);
  });

  it('counts null, spaces and a number that is not finite as empty, and 0 as a value', () => {
    expect([null, undefined, '', ' \t', Number.NaN, Number.POSITIVE_INFINITY].every(isEmptyEntry)).toBe(true);
    expect([0, '0', 'x'].some(isEmptyEntry)).toBe(false);
  });

  it('asks for a reason when a row is excluded without one', () => {
    expect(lacksReason(true, '  ')).toBe(true);
    expect(lacksReason(true, null)).toBe(true);
    expect(lacksReason(true, 'clotted')).toBe(false);
    expect(lacksReason(false, '')).toBe(false);
    expect(EXCLUDED_WITHOUT_REASON).toBe('excluded without a reason; give the reason');
  });
});
