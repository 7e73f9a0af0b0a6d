import { Signal, computed, signal } from '@angular/core';
import type { Sort } from '@angular/material/sort';

/** The value a column sorts by. */
export type SortValue<T> = (row: T, column: string) => string | number | boolean | null;

const collator = new Intl.Collator(undefined, { numeric: true, sensitivity: 'base' });

function compare(a: string | number | boolean | null, b: string | number | boolean | null): number {
  if (a === b) return 0;
  if (a === null) return 1;
  if (b === null) return -1;
  if (typeof a === 'string' && typeof b === 'string') return collator.compare(a, b);
  return a < b ? -1 : 1;
}

/**
 * What a table shows of a list: rows whose text holds every word of the filter, sorted by the
 * column a MatSort header chose. Empty values sort last either way.
 */
export class TableView<T> {
  readonly filter = signal('');
  readonly sort = signal<Sort>({ active: '', direction: '' });

  readonly rows: Signal<T[]> = computed(() => {
    const words = this.filter().toLowerCase().split(/\s+/).filter(Boolean);
    const rows = this.source().filter((row) => {
      const text = this.text(row).toLowerCase();
      return words.every((word) => text.includes(word));
    });
    const { active, direction } = this.sort();
    if (!active || !direction) return rows;
    const sign = direction === 'asc' ? 1 : -1;
    return [...rows].sort((a, b) => {
      const x = this.value(a, active);
      const y = this.value(b, active);
      if (x === null || y === null) return compare(x, y);
      return sign * compare(x, y);
    });
  });

  constructor(
    private readonly source: Signal<readonly T[]>,
    private readonly text: (row: T) => string,
    private readonly value: SortValue<T>,
  ) {}
}
