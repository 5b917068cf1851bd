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
        path: 'stocks/:id',
        canMatch: [roleGuard('admin', 'assessor', 'board')],
        loadComponent: () => import('./stocks/stock-detail').then((m) => m.StockDetail),
        title: 'Stock · Brinkmark',
      },
      {
        path: 'runs/:id',
        canMatch: [roleGuard('admin', 'assessor', 'board')],
        loadComponent: () => import('./runs/run-page').then((m) => m.RunPage),
        title: 'Model run · Brinkmark',
      },
      {
        path: 'proposals/new',
        canMatch: [roleGuard('assessor')],
        loadComponent: () => import('./proposals/proposal-page').then((m) => m.ProposalPage),
        title: 'New proposal · Brinkmark',
      },
      {
        path: 'proposals/:id',
        canMatch: [roleGuard('admin', 'assessor', 'board')],
        loadComponent: () => import('./proposals/proposal-page').then((m) => m.ProposalPage),
        title: 'Proposal · Brinkmark',
      },
      {
        path: 'board',
        canMatch: [roleGuard('board', 'admin')],
        loadComponent: () => import('./board/board-queue').then((m) => m.BoardQueue),
        title: 'Board · Brinkmark',
      },
      {
        path: 'advisories',
        canMatch: [roleGuard('admin', 'assessor', 'board', 'licensee')],
        loadComponent: () => import('./advisories/advisories-page').then((m) => m.AdvisoriesPage),
        title: 'Advisories · Brinkmark',
      },
      {
        path: 'portal',
        canMatch: [roleGuard('licensee')],
        loadComponent: () => import('./subscriptions/portal').then((m) => m.Portal),
        title: 'Portal · Brinkmark',
      },
      {
        path: 'admin/mail',
        canMatch: [roleGuard('admin')],
        loadComponent: () => import('./admin/mail-outbox').then((m) => m.MailOutbox),
        title: 'Mail outbox · Brinkmark',
      },
      {
        path: 'admin/users',
        canMatch: [roleGuard('admin')],
        loadComponent: () => import('./admin/user-admin').then((m) => m.UserAdmin),
        title: 'People and roles · Brinkmark',
      },
      { path: 'not-allowed', loadComponent: () => import('./home/not-allowed').then((m) => m.NotAllowed), title: 'Not open to your role · Brinkmark' },
      { path: '**', loadComponent: () => import('./home/not-found').then((m) => m.NotFound), title: 'Not found · Brinkmark' },
    ],
  },
  { path: '**', redirectTo: 'sign-in' },
];
