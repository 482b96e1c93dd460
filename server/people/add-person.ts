import type { Transaction } from 'sequelize';
import type { AuditEntry, AuditRepository } from '../audit/audit-repository.ts';
import type { Database } from '../db/database.ts';
import { RecordsError } from '../records/records-error.ts';
import type { PeopleRepository } from './people-repository.ts';
import type { Person, Role } from '../../shared/api/person.ts';

/** A person to add, with the password they sign in with. */
export interface NewPersonRequest {
  readonly username: string;
  readonly displayName: string;
  readonly email: string | null;
  readonly role: Role;
  readonly password: string;
}

/** Who a change to the people is written as in the audit log: a person, or a named tool. */
export type AuditedBy = Pick<AuditEntry, 'actor' | 'actorName' | 'ip'>;

/** What the people use cases need. */
export interface PeopleDeps {
  readonly db: Database;
  readonly people: PeopleRepository;
  readonly audit: AuditRepository;
}

/** The refusal of a username someone has already. */
export function usernameTaken(username: string): RecordsError {
  return new RecordsError('conflict', 'username-taken', `the username "${username}" is taken`);
}

/** Whether an error is SQLite refusing a second person with the same username. */
function isUsernameTaken(error: unknown): boolean {
  return (error as { name?: string }).name === 'SequelizeUniqueConstraintError';
}

/**
 * Adds a person with their audit entry in one write; `alongside` runs in the same write (an
 * invitation sent with the add). A taken username is refused inside the write, so two adds of one
 * name at once cannot both pass.
 */
export async function addPerson<T = undefined>(
  request: NewPersonRequest,
  by: AuditedBy,
  { db, people, audit }: PeopleDeps,
  alongside?: (transaction: Transaction, added: Person) => Promise<T>,
): Promise<{ person: Person; alongside: T | undefined }> {
  return db.write(async (transaction) => {
    if (await people.findByUsername(request.username, transaction))
      throw usernameTaken(request.username);
    const person = await people.add(request, transaction).catch((error: unknown) => {
      throw isUsernameTaken(error) ? usernameTaken(request.username) : error;
    });
    await audit.append(
      { ...by, action: 'person-add', subject: person.username, detail: { role: person.role } },
      transaction,
    );
    return { person, alongside: await alongside?.(transaction, person) };
  });
}
