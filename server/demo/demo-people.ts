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

/** The demo group's second shop (invented, as the smokehouse is): its key and name. */
export const DEMO_SHOP = { key: 'saltmarrow', name: 'Saltmarrow Quay shop' } as const;

/**
 * The second shop's own cook: a cook there and nowhere else (no role at the smokehouse), so the
 * demo shows a person who sees one site of a group.
 */
export const DEMO_SHOP_COOK: NewPerson = {
  username: 'maren',
  email: 'maren@quillmoor.invalid',
  displayName: 'Maren Oskelby (shop cook)',
  role: 'cook',
  password: 'quillmoor-quay',
  demo: true,
};

/** The demo's sign-ins for a demo of `sites` sites: the second shop's cook only with two. */
export function demoPeople(sites: 1 | 2): readonly NewPerson[] {
  return sites === 2 ? [...DEMO_PEOPLE, DEMO_SHOP_COOK] : DEMO_PEOPLE;
}

/**
 * What the demo's sign-in page shows: its kitchen and its sign-ins, only when the server runs
 * as the demo (LARDER_MODE unset or demo); any other install tells nothing, whoever is in its
 * database.
 */
export function demoInfo(
  config: Pick<ServerConfig, 'mode' | 'kitchenName' | 'demoSites'>,
): DemoInfo {
  if (config.mode !== 'demo') return { demo: false, kitchen: null, signIns: [] };
  return {
    demo: true,
    kitchen: config.kitchenName,
    signIns: demoPeople(config.demoSites).map(({ username, displayName, role, password }) => ({
      username,
      displayName,
      role,
      password,
    })),
  };
}
