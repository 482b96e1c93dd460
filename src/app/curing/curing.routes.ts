import type { Routes } from '@angular/router';

export default [
  {
    path: '',
    title: 'Today · Larderbook',
    loadComponent: () => import('./today-board/today-board'),
  },
] satisfies Routes;
