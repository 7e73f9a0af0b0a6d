import { inject } from '@angular/core';
import { Routes } from '@angular/router';
import { authGuard } from './core/auth/auth.guard';
import { roleGuard } from './core/auth/role.guard';
import { Notices } from './core/notify/notices';

/** Every page is a lazy chunk; the sign-in page loads nothing of the signed-in pages. */
export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Parallax',
    loadComponent: () => import('./core/auth/sign-in-page/sign-in-page').then((m) => m.SignInPage),
  },
  {
    path: 'forgot-password',
    title: 'Forgot your password? · Parallax',
    loadComponent: () => import('./core/auth/forgot-password-page/forgot-password-page').then((m) => m.ForgotPasswordPage),
  },
  {
    path: 'set-password/:token',
    title: 'Choose a password · Parallax',
    loadComponent: () => import('./core/auth/set-password-page/set-password-page').then((m) => m.SetPasswordPage),
  },
  {
    path: '',
    canActivate: [authGuard],
    loadComponent: () => import('./core/layout/shell/shell').then((m) => m.Shell),
    children: [
      {
        path: '',
        pathMatch: 'full',
        title: 'Worklist · Parallax',
        loadComponent: () => import('./features/worklist/worklist-page/worklist-page').then((m) => m.WorklistPage),
      },
      {
        path: 'studies/:id/review',
        title: 'Review · Parallax',
        canActivate: [roleGuard('director', 'technologist', 'quality')],
        loadComponent: () => import('./features/review/review-page/review-page').then((m) => m.ReviewPage),
      },
      {
        path: 'studies',
        canActivate: [roleGuard('technologist', 'director', 'quality')],
        loadChildren: () => import('./features/studies/studies.routes').then((m) => m.STUDIES_ROUTES),
      },
      {
        path: 'releases',
        canActivate: [roleGuard('technologist', 'director', 'quality')],
        loadChildren: () => import('./features/releases/releases.routes').then((m) => m.RELEASES_ROUTES),
      },
      {
        path: 'profile',
        title: 'Profile · Parallax',
        loadComponent: () => import('./features/profile/profile-page/profile-page').then((m) => m.ProfilePage),
      },
      {
        path: 'archive',
        canActivate: [roleGuard('director', 'quality')],
        loadChildren: () => import('./features/archive/archive.routes').then((m) => m.ARCHIVE_ROUTES),
      },
      {
        path: 'history',
        canActivate: [roleGuard('director', 'quality')],
        loadChildren: () => import('./features/archive/archive.routes').then((m) => m.HISTORY_ROUTES),
      },
      {
        path: 'admin/laboratory',
        title: 'Laboratory · Parallax',
        canActivate: [roleGuard('admin')],
        loadComponent: () =>
          import('./features/admin/laboratory-settings/laboratory-settings-page').then((m) => m.LaboratorySettingsPage),
      },
      {
        path: 'admin',
        canActivate: [roleGuard('admin')],
        loadChildren: () => import('./features/admin/admin.routes').then((m) => m.ADMIN_ROUTES),
      },
    ],
  },
  {
    path: '**',
    redirectTo: () => {
      inject(Notices).post('There is no page at that address; here is your worklist.');
      return '/';
    },
  },
];
