import { personNeeded, type PersonVerb } from './records-failure.ts';

/** A sign-in name and password. */
export interface Credentials {
  readonly username: string;
  readonly password: string;
}

/**
 * Who the command acts as, from $LARDER_USER and $LARDER_PASSWORD; when they are not set, the
 * verb asks for them in its own words.
 * @param url the server to sign in to, or none for this machine's records
 */
export function credentialsFor(verb: PersonVerb, url?: string): Credentials {
  const username = process.env.LARDER_USER;
  const password = process.env.LARDER_PASSWORD;
  if (!username || !password) throw personNeeded(verb, url);
  return { username, password };
}
