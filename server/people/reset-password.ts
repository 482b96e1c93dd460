import type { Transaction } from 'sequelize';
import { RecordsError } from '../records/records-error.ts';
import type { AuditedBy, PeopleDeps } from './add-person.ts';
import type { PeopleRepository } from './people-repository.ts';
import type { Person } from '../../shared/api/person.ts';

/** A person asked for by id (the API) or by username (the command line). */
export type PersonKey = { readonly id: number } | { readonly username: string };

/** The person a key names; not found when there is none. */
export async function mustFindPerson(
  key: PersonKey,
  people: PeopleRepository,
  transaction?: Transaction,
): Promise<Person> {
  const person =
    'id' in key
      ? await people.findById(key.id, transaction)
      : await people.findByUsername(key.username, transaction);
  if (person) return person;
  throw new RecordsError(
    'not-found',
    'not-found',
    'id' in key ? `no person with id ${key.id}` : `no person "${key.username}"`,
  );
}

/** Sets another person's password (an admin's reset, a locked-out admin), with its audit entry. */
export async function resetPassword(
  key: PersonKey,
  password: string,
  by: AuditedBy,
  { db, people, audit }: PeopleDeps,
): Promise<void> {
  await db.write(async (transaction) => {
    const person = await mustFindPerson(key, people, transaction);
    await people.setPassword(person.id, password, transaction);
    await audit.append({ ...by, action: 'password-reset', subject: person.username }, transaction);
  });
}
