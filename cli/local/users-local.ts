import { MIN_PASSWORD_LENGTH } from '../../server/auth/passwords.ts';
import { AuditRepository } from '../../server/audit/audit-repository.ts';
import { PeopleRepository } from '../../server/people/people-repository.ts';
import type { Person, Role } from '../../shared/api/person.ts';
import { CliError, EXIT } from '../cli-error.ts';
import { withLocalDatabase } from './local-database.ts';
import { readNewPassword } from './read-password.ts';

/** Adds a person to the local database; the way the first admin of a production install is made. */
export function addUser(options: {
  username: string;
  displayName: string;
  role: Role;
  email?: string;
}): Promise<Person> {
  return withLocalDatabase(async (db) => {
    const people = new PeopleRepository(db);
    if (await people.findByUsername(options.username))
      throw new CliError(`the username "${options.username}" is taken`, EXIT.usage);
    const password = await readNewPassword(MIN_PASSWORD_LENGTH);
    return db.write(async (transaction) => {
      const person = await people.add(
        { ...options, email: options.email ?? null, password },
        transaction,
      );
      await new AuditRepository(db).append(
        {
          actorName: 'larder users add (command line)',
          action: 'person-add',
          subject: person.username,
          detail: { role: person.role },
        },
        transaction,
      );
      return person;
    });
  });
}

/** Everyone in the local database. */
export function listUsers(): Promise<Person[]> {
  return withLocalDatabase((db) => new PeopleRepository(db).list());
}

/** Sets a person's password in the local database (a locked-out admin). */
export function setUserPassword(username: string): Promise<void> {
  return withLocalDatabase(async (db) => {
    const people = new PeopleRepository(db);
    const person = await people.findByUsername(username);
    if (!person) throw new CliError(`no person "${username}"`, EXIT.usage);
    const password = await readNewPassword(MIN_PASSWORD_LENGTH);
    await db.write(async (transaction) => {
      await people.setPassword(person.id, password, transaction);
      await new AuditRepository(db).append(
        {
          actorName: 'larder users set-password (command line)',
          action: 'password-reset',
          subject: username,
        },
        transaction,
      );
    });
  });
}
