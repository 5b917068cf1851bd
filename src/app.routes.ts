import { Routes } from '@angular/router';
import { roleGuard } from './core/auth/role.guard';

export const routes: Routes = [
  { path: 'sign-in', loadComponent: () => import('./core/auth/sign-in').then((m) => m.SignIn), title: 'Sign in · Brinkmark' },
  {
    path: '',
    canMatch: [roleGuard('admin', 'assessor', 'board', 'licensee')],
    children: [
      { path: '', pathMatch: 'full', loadComponent: () => import('./home/home').then((m) => m.Home), title: 'Home · Brinkmark' },
      {
        path: 'stocks',
        canMatch: [roleGuard('admin', 'assessor', 'board', 'licensee')],
        loadComponent: () => import('./stocks/stock-list').then((m) => m.StockList),
        title: 'Stocks · Brinkmark',
      },
      {
        path: 'admin/users',
        canMatch: [roleGuard('admin')],
        loadComponent: () => import('./admin/user-admin').then((m) => m.UserAdmin),
        title: 'People and roles · Brinkmark',
      },
      { path: '**', loadComponent: () => import('./home/not-found').then((m) => m.NotFound), title: 'Not found · Brinkmark' },
    ],
  },
  { path: '**', redirectTo: 'sign-in' },
];
