import { Routes } from '@angular/router';
import { roleGuard } from '../../core/auth/role.guard';
import { unsavedSetupGuard } from './setup/unsaved-setup.guard';

/** Studies: the list, a new study, and one study with its Setup, Specimens and Findings tabs (each its own chunk). */
export const STUDIES_ROUTES: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Studies · Parallax',
    loadComponent: () => import('./study-list/study-list-page').then((m) => m.StudyListPage),
  },
  {
    path: 'new',
    title: 'New study · Parallax',
    canActivate: [roleGuard('technologist', 'director')],
    canDeactivate: [unsavedSetupGuard],
    loadComponent: () => import('./setup/new-study-page/new-study-page').then((m) => m.NewStudyPage),
  },
  {
    path: ':id',
    title: 'Study · Parallax',
    loadComponent: () => import('./study/study-page').then((m) => m.StudyPage),
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'setup' },
      {
        path: 'setup',
        title: 'Setup · Parallax',
        canDeactivate: [unsavedSetupGuard],
        loadComponent: () => import('./setup/setup-tab/setup-tab').then((m) => m.SetupTab),
      },
      {
        path: 'specimens',
        title: 'Specimens · Parallax',
        loadComponent: () => import('./specimens/specimens-tab/specimens-tab').then((m) => m.SpecimensTab),
      },
      {
        path: 'findings',
        title: 'Findings · Parallax',
        loadComponent: () => import('./findings/findings-tab/findings-tab').then((m) => m.FindingsTab),
      },
      {
        path: 'history',
        title: 'History · Parallax',
        loadComponent: () => import('./study/history-tab').then((m) => m.HistoryTab),
      },
    ],
  },
];
