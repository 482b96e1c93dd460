import { randomBytes, randomInt, scrypt, timingSafeEqual, type ScryptOptions } from 'node:crypto';
import { passwordHashes, type HashLane } from './password-hash-queue.ts';

// scrypt (RFC 7914) with N = 2^15, r = 8, p = 1: about 32 MiB and tens of milliseconds per
// hash, slow enough to blunt guessing. Parameters from memory of common interactive-login guidance.
const COST = { N: 2 ** 15, r: 8, p: 1, maxmem: 64 * 1024 * 1024 };
const KEY_LENGTH = 32;

/** The shortest password we accept. source: NIST SP 800-63B §5.1.1.2 (at least 8 characters) */
export const MIN_PASSWORD_LENGTH = 8;

// A valid hash of a random password, used to spend the same time on unknown usernames.
const DUMMY_HASH =
  'scrypt$32768$8$1$AAAAAAAAAAAAAAAAAAAAAA==$AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA=';

function derive(
  lane: HashLane,
  password: string,
  salt: Buffer,
  options: ScryptOptions,
): Promise<Buffer> {
  return passwordHashes.run(
    lane,
    () =>
      new Promise((resolve, reject) => {
        scrypt(password.normalize('NFKC'), salt, KEY_LENGTH, options, (error, key) =>
          error ? reject(error) : resolve(key),
        );
      }),
  );
}

/**
 * Hashes a password with a random salt: "scrypt$N$r$p$salt$hash" (base64). Setting a password is
 * done by someone signed in, an invitation's holder or the command line: it goes ahead of
 * sign-ins in the queue of hashes.
 */
export async function hashPassword(password: string): Promise<string> {
  const salt = randomBytes(16);
  const key = await derive('account', password, salt, COST);
  return ['scrypt', COST.N, COST.r, COST.p, salt.toString('base64'), key.toString('base64')].join(
    '$',
  );
}

/**
 * Whether a password matches a stored hash, compared in constant time. Without a stored hash (an
 * unknown username) a dummy one is hashed, so the answer takes as long either way.
 * @param lane whose check it is: a sign-in's may be refused when too many wait (503 sign-in-busy)
 */
export async function verifyPassword(
  password: string,
  stored: string | undefined,
  lane: HashLane,
): Promise<boolean> {
  const [scheme, n, r, p, salt, hash] = (stored ?? DUMMY_HASH).split('$');
  if (scheme !== 'scrypt' || !salt || !hash) return false;
  const expected = Buffer.from(hash, 'base64');
  const key = await derive(lane, password, Buffer.from(salt, 'base64'), {
    N: Number(n),
    r: Number(r),
    p: Number(p),
    maxmem: COST.maxmem,
  });
  return stored !== undefined && key.length === expected.length && timingSafeEqual(key, expected);
}

/** A random password for a reset or an invitation: 16 characters, no look-alikes. */
export function randomPassword(): string {
  const alphabet = 'abcdefghjkmnpqrstuvwxyzABCDEFGHJKLMNPQRSTUVWXYZ23456789';
  return Array.from({ length: 16 }, () => alphabet[randomInt(alphabet.length)]).join('');
}
