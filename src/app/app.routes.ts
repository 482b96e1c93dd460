import { Routes } from '@angular/router';
import { authGuard, roleGuard } from './core/auth/auth-guard';
import { forRolesRoute } from './core/auth/role-routes';

export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Larderbook',
    loadComponent: () => import('./core/auth/sign-in/sign-in'),
  },
  {
    // An invitation's link: public, like sign-in; the token in the link is the proof.
    path: 'set-password',
    title: 'Set your password · Larderbook',
    loadComponent: () => import('./account/set-password/set-password'),
  },
  {
    path: '',
    canMatch: [authGuard],
    loadComponent: () => import('./core/layout/shell/shell'),
    children: [
      // The daily board is where a cook starts.
      { path: '', pathMatch: 'full', redirectTo: 'today' },
      { path: 'today', loadChildren: () => import('./curing/curing.routes') },
      // The board's old address, kept for bookmarks and links.
      { path: 'curing', pathMatch: 'full', redirectTo: 'today' },
      { path: 'formulas', loadChildren: () => import('./formulas/formulas.routes') },
      { path: 'batches', loadChildren: () => import('./batches/batches.routes') },
      { path: 'plans', loadChildren: () => import('./plans/plans.routes') },
      { path: 'equipment', loadChildren: () => import('./equipment/equipment.routes') },
      { path: 'trace', loadChildren: () => import('./trace/trace.routes') },
      { path: 'deliveries', loadChildren: () => import('./stock/stock.routes') },
      {
        path: 'reports',
        canMatch: [roleGuard('admin', 'reviewer')],
        loadChildren: () => import('./reports/reports.routes'),
      },
      forRolesRoute('reports', 'admin', 'reviewer'),
      {
        path: 'costing',
        canMatch: [roleGuard('admin', 'reviewer')],
        loadChildren: () => import('./costing/costing.routes'),
      },
      forRolesRoute('costing', 'admin', 'reviewer'),
      {
        path: 'people',
        canMatch: [roleGuard('admin')],
        loadChildren: () => import('./people/people.routes'),
      },
      forRolesRoute('people', 'admin'),
      {
        path: '**',
        title: 'Not found · Larderbook',
        loadComponent: () => import('./core/layout/not-found/not-found'),
      },
    ],
  },
];
