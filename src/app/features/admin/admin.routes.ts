import { Routes } from '@angular/router';

/** Admin pages; app.routes.ts guards the whole branch with roleGuard('admin'). */
export const ADMIN_ROUTES: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'users' },
  {
    path: 'users',
    title: 'Users · Parallax',
    loadComponent: () => import('./users/user-list/user-list').then((m) => m.UserList),
  },
  {
    path: 'analytes',
    title: 'Analytes · Parallax',
    loadComponent: () => import('./analytes/analyte-list/analyte-list').then((m) => m.AnalyteList),
  },
  {
    path: 'instruments',
    title: 'Instruments · Parallax',
    loadComponent: () => import('./instruments/instrument-list/instrument-list').then((m) => m.InstrumentList),
  },
  {
    path: 'release-templates',
    title: 'Release templates · Parallax',
    loadComponent: () => import('./release-templates/release-templates-page').then((m) => m.ReleaseTemplatesPage),
  },
  {
    path: 'mailbox',
    title: 'Mailbox · Parallax',
    loadComponent: () => import('./mailbox/mailbox-page/mailbox-page').then((m) => m.MailboxPage),
  },
];
