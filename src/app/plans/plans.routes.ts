import type { Routes } from '@angular/router';

export default [
  {
    path: '',
    title: 'Plans · Larderbook',
    loadComponent: () => import('./plan-page/plan-page'),
  },
] satisfies Routes;
