import type { Routes } from '@angular/router';

export default [
  {
    path: '',
    title: 'Equipment · Larderbook',
    loadComponent: () => import('./equipment-page/equipment-page'),
  },
] satisfies Routes;
