import type { Routes } from '@angular/router';

export default [
  {
    path: '',
    title: 'Deliveries · Larderbook',
    loadComponent: () => import('./deliveries-page/deliveries-page'),
  },
] satisfies Routes;
