import { MIN_PASSWORD_LENGTH, type Person, type Role } from '../../server/records/records.ts';
import { withLocalRecords } from '../records/local-records.ts';
import { readNewPassword } from './read-password.ts';

/** Adds a person to the local database; the way the first admin of a production install is made. */
export function addUser(options: {
  username: string;
  displayName: string;
  role: Role;
  email?: string;
}): Promise<Person> {
  return withLocalRecords('users', async (records) => {
    // A taken name is refused before a password is asked for.
    await records.usernameFree(options.username);
    const password = await readNewPassword(MIN_PASSWORD_LENGTH);
    const { person } = await records.addPerson(
      { ...options, email: options.email ?? null, password },
      { actorName: 'larder users add (command line)' },
    );
    return person;
  });
}

/** Everyone in the local database. */
export function listUsers(): Promise<Person[]> {
  return withLocalRecords('users', (records) => records.listPeople());
}

/** Sets a person's password in the local database (a locked-out admin). */
export function setUserPassword(username: string): Promise<void> {
  return withLocalRecords('users', async (records) => {
    // An unknown name is refused before a password is asked for.
    await records.person({ username });
    const password = await readNewPassword(MIN_PASSWORD_LENGTH);
    await records.resetPassword({ username }, password, {
      actorName: 'larder users set-password (command line)',
    });
  });
}
