import type { NewPerson } from '../people/people-repository.ts';

/**
 * The sign-ins of the invented Quillmoor Smokehouse, printed when the demo starts. These names
 * and passwords exist only in demo mode; production creates no demo people. Their addresses are
 * under .invalid, a name reserved never to exist (RFC 2606): mail to them reaches nobody.
 */
export const DEMO_PEOPLE: readonly NewPerson[] = [
  {
    username: 'rosa',
    email: 'rosa@quillmoor.invalid',
    displayName: 'Rosa Quennick (head cook)',
    role: 'admin',
    password: 'quillmoor-admin',
    demo: true,
  },
  {
    username: 'tobin',
    email: 'tobin@quillmoor.invalid',
    displayName: 'Tobin Marrowfeld (cook)',
    role: 'cook',
    password: 'quillmoor-cook',
    demo: true,
  },
  {
    username: 'imke',
    email: 'imke@quillmoor.invalid',
    displayName: 'Imke Tressaly (food safety)',
    role: 'reviewer',
    password: 'quillmoor-review',
    demo: true,
  },
];
