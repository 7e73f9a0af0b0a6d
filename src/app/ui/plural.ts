import { Pipe, PipeTransform } from '@angular/core';
import { plural } from '@shared/types/plural';

/** A count with its noun in a template: {{ n | plural: 'row' }} → "1 row", "3 rows" (see shared/types/plural). */
@Pipe({ name: 'plural' })
export class PluralPipe implements PipeTransform {
  transform(count: number | null | undefined, one: string, many?: string): string {
    return plural(count ?? 0, one, many);
  }
}
