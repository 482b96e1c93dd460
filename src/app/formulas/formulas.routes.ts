import { Routes } from '@angular/router';

export default [
  { path: '', title: 'Formulas · Larderbook', loadComponent: () => import('./placeholder') },
] satisfies Routes;
