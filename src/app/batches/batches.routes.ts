import type { ResolveFn, Routes } from '@angular/router';
import { roleGuard } from '../core/auth/auth-guard';
import { forRolesRoute } from '../core/auth/role-routes';

/** A batch page's title names its lot. */
const lotTitle: ResolveFn<string> = (route) =>
  `Lot ${String(route.paramMap.get('lot') ?? '').toUpperCase()} · Larderbook`;

export default [
  {
    path: '',
    title: 'Batch log · Larderbook',
    loadComponent: () => import('./batch-log/batch-log-page'),
  },
  {
    path: 'new',
    title: 'Record a batch · Larderbook',
    canMatch: [roleGuard('admin', 'cook')],
    loadComponent: () => import('./record-batch/record-batch-page'),
  },
  forRolesRoute('new', 'admin', 'cook'),
  {
    path: ':lot',
    title: lotTitle,
    loadComponent: () => import('./batch-page/batch-page'),
  },
] satisfies Routes;
