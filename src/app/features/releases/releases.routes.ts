import { Routes } from '@angular/router';

/** Releases: the list and one release's board (app.routes.ts guards the branch for technologists, directors and quality). */
export const RELEASES_ROUTES: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Releases · Parallax',
    loadComponent: () => import('./release-list/release-list-page').then((m) => m.ReleaseListPage),
  },
  {
    path: ':id',
    title: 'Release · Parallax',
    loadComponent: () => import('./release-board/release-board-page').then((m) => m.ReleaseBoardPage),
  },
];
