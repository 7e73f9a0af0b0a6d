import { INTERVAL_FIELDS } from '@shared/schemas';
import { blankRow, toInput } from '../specimens/specimen-layout';
import { mappableFields } from '../specimens/upload-dialog/upload-mapping';
import { INTERVAL_LAYOUT } from './interval-layout';

describe('interval layout', () => {
  it('has the fields the API takes for interval rows, in order', () => {
    expect(INTERVAL_LAYOUT.fields.map((f) => f.field)).toEqual([...INTERVAL_FIELDS]);
  });

  it('lets an upload map label, value, sex, age band and note, with the value required', () => {
    expect(mappableFields(INTERVAL_LAYOUT).map((f) => [f.field, f.required])).toEqual([
      ['label', false], ['value', true], ['sex', false], ['ageBand', false], ['note', false],
    ]);
  });

  it('sends empty sex and age band as null and the value as trimmed text', () => {
    const row = { ...blankRow(INTERVAL_LAYOUT), label: 'R1', value: ' 4.20 ' };
    expect(toInput(row, INTERVAL_LAYOUT)).toEqual({
      label: 'R1', value: '4.20', sex: null, ageBand: null, excluded: false, exclusionReason: null, note: '',
    });
  });
});
