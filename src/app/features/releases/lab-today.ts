import { Signal, computed } from '@angular/core';
import { laboratoryDate } from '../../../../shared/types/lab-time';
import { labZone } from '../../ui/lab-time';

/** The laboratory's today as yyyy-mm-dd (call in an injection context), for due dates in words. */
export function labToday(): Signal<string> {
  const zone = labZone();
  return computed(() => laboratoryDate(new Date(), zone()));
}
