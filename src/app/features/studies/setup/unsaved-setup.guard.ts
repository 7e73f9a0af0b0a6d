import { inject } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import type { CanDeactivateFn } from '@angular/router';
import { Observable, map, of } from 'rxjs';
import { ConfirmData, ConfirmDialog } from '../../../ui/confirm-dialog/confirm-dialog';

/** A page holding a Setup form that may have unsaved changes. */
export interface HoldsSetup {
  hasUnsavedSetup(): boolean;
}

/** Asks before leaving a Setup form with unsaved changes (the other tabs are saved as they go). */
export const unsavedSetupGuard: CanDeactivateFn<HoldsSetup> = (page): Observable<boolean> => {
  if (!page.hasUnsavedSetup()) return of(true);
  const data: ConfirmData = {
    title: 'Leave without saving?',
    text: 'The setup has changes that are not saved. If you leave now, they are lost.',
    action: 'Leave without saving',
  };
  return inject(MatDialog).open(ConfirmDialog, { data, width: '440px' }).afterClosed().pipe(map((leave) => leave === true));
};
