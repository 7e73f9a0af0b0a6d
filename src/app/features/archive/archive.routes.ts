import { Routes } from '@angular/router';

/** Archive: the search, and one study's audit record. app.routes.ts guards the branch (director, quality). */
export const ARCHIVE_ROUTES: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Archive · Parallax',
    loadComponent: () => import('./archive-page/archive-page').then((m) => m.ArchivePage),
  },
  {
    path: ':id',
    title: 'Audit record · Parallax',
    loadComponent: () => import('./audit-record/audit-record-page').then((m) => m.AuditRecordPage),
  },
];

/** History: everything recorded in the laboratory. app.routes.ts guards the branch (director, quality). */
export const HISTORY_ROUTES: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'History · Parallax',
    loadComponent: () => import('./lab-history/lab-history-page').then((m) => m.LabHistoryPage),
  },
];
