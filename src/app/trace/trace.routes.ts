import type { Routes } from '@angular/router';

export default [
  {
    path: '',
    title: 'Trace · Larderbook',
    loadComponent: () => import('./trace-page/trace-page'),
  },
] satisfies Routes;
