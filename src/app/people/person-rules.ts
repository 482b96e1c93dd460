// The same limits the server checks in server/people/people-router.ts; the server stays the authority.

/** A username: lower-case, starts with a letter, 2 to 32 characters of letters, digits, . _ - */
export const USERNAME_PATTERN = /^[a-z][a-z0-9._-]{1,31}$/;

/** An e-mail address: something@something.something, no spaces. */
export const EMAIL_PATTERN = /^[^@\s]+@[^@\s]+\.[^@\s]+$/;

/** The longest display name. */
export const DISPLAY_NAME_MAX = 80;

/** The longest e-mail address. */
export const EMAIL_MAX = 200;

/** The shortest password the server accepts (NIST SP 800-63B: at least 8 characters). */
export const PASSWORD_MIN = 8;

/** The longest password the server accepts. */
export const PASSWORD_MAX = 256;
