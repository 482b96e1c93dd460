import { Routes } from '@angular/router';

export default [
  { path: '', title: 'Batch log · Larderbook', loadComponent: () => import('./placeholder') },
] satisfies Routes;
