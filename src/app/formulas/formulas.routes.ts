import { Routes } from '@angular/router';
import { unsavedChangesGuard } from './unsaved-changes-guard';

export default [
  {
    path: '',
    title: 'Formulas · Larderbook',
    loadComponent: () => import('./formula-list/formula-list'),
  },
  {
    path: ':id',
    title: 'Formula · Larderbook',
    loadComponent: () => import('./formula-page/formula-page'),
    canDeactivate: [unsavedChangesGuard],
  },
] satisfies Routes;
