import { signal } from '@angular/core';
import { TableView } from './table-view';

interface Row { name: string; dose: number | null }

const rows = signal<Row[]>([
  { name: 'Sodium 10', dose: 10 },
  { name: 'sodium 9', dose: null },
  { name: 'Calcium', dose: 2 },
]);
const view = () => new TableView<Row>(rows, (r) => r.name, (r, column) => (column === 'dose' ? r.dose : r.name));

describe('TableView', () => {
  it('keeps the rows whose text holds every word of the filter, in any case', () => {
    const v = view();
    v.filter.set('SODIUM  10');
    expect(v.rows().map((r) => r.name)).toEqual(['Sodium 10']);
    v.filter.set('');
    expect(v.rows()).toHaveLength(3);
  });

  it('sorts text naturally (9 before 10) and ignores case', () => {
    const v = view();
    v.sort.set({ active: 'name', direction: 'asc' });
    expect(v.rows().map((r) => r.name)).toEqual(['Calcium', 'sodium 9', 'Sodium 10']);
    v.sort.set({ active: 'name', direction: 'desc' });
    expect(v.rows().map((r) => r.name)).toEqual(['Sodium 10', 'sodium 9', 'Calcium']);
  });

  it('sorts numbers as numbers and puts empty values last in both directions', () => {
    const v = view();
    v.sort.set({ active: 'dose', direction: 'asc' });
    expect(v.rows().map((r) => r.dose)).toEqual([2, 10, null]);
    v.sort.set({ active: 'dose', direction: 'desc' });
    expect(v.rows().map((r) => r.dose)).toEqual([10, 2, null]);
  });

  it('follows the source list when it changes', () => {
    const source = signal<Row[]>([]);
    const v = new TableView<Row>(source, (r) => r.name, (r) => r.name);
    source.set([{ name: 'Urea', dose: 1 }]);
    expect(v.rows()).toEqual([{ name: 'Urea', dose: 1 }]);
  });
});
