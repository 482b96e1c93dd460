import type { Database } from '../../server/db/database.ts';
import { PeopleRepository } from '../../server/people/people-repository.ts';
import type { Person } from '../../shared/api/person.ts';
import { CliError, EXIT } from '../cli-error.ts';

/**
 * The person recording, from $LARDER_USER and $LARDER_PASSWORD, checked against the database
 * as the server would: the command line is held to the same sign-in and roles.
 */
export async function operatorFromEnvironment(
  db: Database,
  roles: readonly Person['role'][],
): Promise<Person> {
  const username = process.env.LARDER_USER;
  const password = process.env.LARDER_PASSWORD;
  if (!username || !password) {
    throw new CliError('say who is recording: set LARDER_USER and LARDER_PASSWORD', EXIT.usage);
  }
  const person = await new PeopleRepository(db).authenticate(username, password);
  if (!person)
    throw new CliError(
      'wrong LARDER_USER or LARDER_PASSWORD, or the account is not active',
      EXIT.usage,
    );
  if (!roles.includes(person.role))
    throw new CliError(
      `${person.username} is a ${person.role}; this needs ${roles.join(' or ')}`,
      EXIT.usage,
    );
  return person;
}
