import type { Routes } from '@angular/router';

export default [
  {
    path: '',
    title: 'HACCP report · Larderbook',
    loadComponent: () => import('./haccp-report/haccp-report'),
  },
] satisfies Routes;
