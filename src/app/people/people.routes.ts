import { Routes } from '@angular/router';

export default [
  { path: '', title: 'People · Larderbook', loadComponent: () => import('./placeholder') },
] satisfies Routes;
