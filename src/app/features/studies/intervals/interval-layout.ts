import type { SpecimenLayout } from '../specimens/specimen-layout';

/**
 * The columns of a reference-interval study: one value per reference individual, with sex and age band
 * for partitioning (verification may leave them empty). Empty sex and age band are sent as null, so an
 * empty cell never forms a subgroup of its own.
 */
export const INTERVAL_LAYOUT: SpecimenLayout = {
  fields: [
    { field: 'label', header: 'Individual label', kind: 'text', words: 'individual label', width: 150 },
    { field: 'value', header: 'Value', kind: 'result', words: 'value', width: 120 },
    { field: 'sex', header: 'Sex (F/M)', kind: 'text', words: 'sex', blankAs: null, width: 110 },
    { field: 'ageBand', header: 'Age band', kind: 'text', words: 'age band', blankAs: null, width: 120 },
    { field: 'excluded', header: 'Excluded', kind: 'flag', words: 'excluded', width: 100 },
    { field: 'exclusionReason', header: 'Exclusion reason', kind: 'text', words: 'exclusion reason', blankAs: null, width: 200, grow: true },
    { field: 'note', header: 'Note', kind: 'text', words: 'note', width: 200, grow: true },
  ],
};
