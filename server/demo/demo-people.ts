import type { DemoInfo } from '../../shared/api/person.ts';
import type { ServerConfig } from '../config.ts';
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

/**
 * What the demo's sign-in page shows: its kitchen and its sign-ins, only when the server runs
 * as the demo (LARDER_MODE unset or demo); any other install tells nothing, whoever is in its
 * database.
 */
export function demoInfo(config: Pick<ServerConfig, 'mode' | 'kitchenName'>): DemoInfo {
  if (config.mode !== 'demo') return { demo: false, kitchen: null, signIns: [] };
  return {
    demo: true,
    kitchen: config.kitchenName,
    signIns: DEMO_PEOPLE.map(({ username, displayName, role, password }) => ({
      username,
      displayName,
      role,
      password,
    })),
  };
}
