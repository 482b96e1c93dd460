import type { AuditRepository } from '../audit/audit-repository.ts';
import type { Database } from '../db/database.ts';
import type { PeopleRepository } from '../people/people-repository.ts';
import type { Person } from '../../shared/api/person.ts';
import { verifyPassword } from './passwords.ts';
import { SignInAttempts, TooManySignIns } from './sign-in-attempts.ts';
import { VerifiedCredentials } from './verified-credentials.ts';

/**
 * Checks the passwords of people signing in, by the form or by HTTP Basic, under one limit of
 * attempts per address (SignInAttempts). An attempt is counted before its password is hashed and
 * given back only if it succeeds; past the limit the answer is 429 and nothing is hashed. The
 * hashes themselves wait their turn in the one bounded queue (passwordHashes).
 */
export class SignIns {
  private readonly attempts: SignInAttempts;
  // HTTP Basic sends the password with every request: one proved right is remembered a minute.
  private readonly remembered = new VerifiedCredentials();

  constructor(
    private readonly people: PeopleRepository,
    limit: number,
    private readonly audit: AuditRepository,
    db: Database,
  ) {
    this.attempts = new SignInAttempts(db, limit);
  }

  /**
   * The person a username and password sign in: undefined when either is wrong or the person is
   * not active (without saying which). With `remember` (HTTP Basic), a password proved right in
   * the last minute is not hashed again, and identical attempts arriving together share a hash
   * and count as one. The first refusal of an address in its window goes in the audit log.
   * @param via how the attempt came: the sign-in form or HTTP Basic (the command, a script)
   * @throws RetryLaterError 429 too-many-attempts when the address is at its limit; 503
   *   sign-in-busy when too many sign-ins wait for their hash
   */
  async check(
    address: string,
    username: string,
    password: string,
    { remember = false, via }: { remember?: boolean; via: 'form' | 'basic' },
  ): Promise<Person | undefined> {
    try {
      return await this.checkPassword(address, username, password, remember);
    } catch (error) {
      if (error instanceof TooManySignIns && error.first)
        await this.audit.append({
          actorName: username,
          action: 'sign-in-throttled',
          detail: { via, retryAfterSeconds: error.retryAfterSeconds },
          ip: address,
        });
      throw error;
    }
  }

  private async checkPassword(
    address: string,
    username: string,
    password: string,
    remember: boolean,
  ): Promise<Person | undefined> {
    await this.attempts.admit(address);
    const account = await this.people.credentials(username);
    const person = account?.person.active ? account.person : undefined;
    const verify = async (): Promise<boolean> => {
      const attempt = await this.attempts.begin(address);
      let right: boolean;
      try {
        right = await verifyPassword(password, account?.passwordHash, 'sign-in');
      } catch (error) {
        // Never checked (the queue was full, or the hash failed): it was no wrong guess.
        await attempt.end(false);
        throw error;
      }
      await attempt.end(!(right && person));
      return right;
    };
    const right =
      remember && account && person
        ? await this.remembered.check(person.id, account.passwordHash, password, verify)
        : await verify();
    return right ? person : undefined;
  }
}
