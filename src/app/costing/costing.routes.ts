import type { Routes } from '@angular/router';

export default [
  {
    path: '',
    title: 'Least-cost blend · Larderbook',
    loadComponent: () => import('./least-cost-blend/least-cost-blend'),
  },
] satisfies Routes;
