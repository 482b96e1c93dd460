import { Routes } from '@angular/router';

export default [
  {
    path: '',
    loadComponent: () => import('./people-page/people-page'),
    children: [
      {
        path: '',
        title: 'People · Larderbook',
        loadComponent: () => import('./people-list/people-list'),
      },
      {
        path: 'audit',
        title: 'Audit log · People · Larderbook',
        loadComponent: () => import('./audit-log/audit-log'),
      },
      {
        path: 'outbox',
        title: 'Outbox · People · Larderbook',
        loadComponent: () => import('./outbox/outbox'),
      },
    ],
  },
] satisfies Routes;
