import type { Routes } from '@angular/router';

export default [
  {
    path: '',
    title: 'Curing now · Larderbook',
    loadComponent: () => import('./curing-now/curing-now'),
  },
] satisfies Routes;
