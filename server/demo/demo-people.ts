import type { NewPerson } from '../people/people-repository.ts';

/**
 * The sign-ins of the invented Quillmoor Smokehouse, printed when the demo starts. These names
 * and passwords exist only in demo mode; production creates no demo people.
 */
export const DEMO_PEOPLE: readonly NewPerson[] = [
  {
    username: 'rosa',
    displayName: 'Rosa Emberly (head cook)',
    role: 'admin',
    password: 'quillmoor-admin',
    demo: true,
  },
  {
    username: 'tobin',
    displayName: 'Tobin Ashgrove (cook)',
    role: 'cook',
    password: 'quillmoor-cook',
    demo: true,
  },
  {
    username: 'imke',
    displayName: 'Imke Saltaire (food safety)',
    role: 'reviewer',
    password: 'quillmoor-review',
    demo: true,
  },
];
