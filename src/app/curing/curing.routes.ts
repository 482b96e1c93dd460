import { Routes } from '@angular/router';

export default [
  { path: '', title: 'Curing now · Larderbook', loadComponent: () => import('./placeholder') },
] satisfies Routes;
