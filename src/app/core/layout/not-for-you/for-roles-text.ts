import type { Role } from '../../api/api-types';

const PLURALS: Readonly<Record<Role, string>> = {
  admin: 'admins',
  cook: 'cooks',
  reviewer: 'reviewers',
};

/**
 * Whom a page is for, in words: "admins", "admins and reviewers".
 * @param roles The roles the page lets in.
 */
export function rolesText(roles: readonly Role[]): string {
  const words = roles.map((role) => PLURALS[role]);
  if (words.length <= 1) return words[0] ?? 'other roles';
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

/**
 * Whom to ask: the active admins by name, or an admin in general while their names are not
 * known (not yet fetched, or none could be read).
 * @param admins The active admins' display names; null before the server has answered.
 */
export function askText(admins: readonly string[] | null): string {
  const ending = 'if you need something done on this page, or if your role should change.';
  if (!admins || admins.length === 0) return `Ask an admin ${ending}`;
  const names =
    admins.length === 1
      ? admins[0]
      : `${admins.slice(0, -1).join(', ')} or ${admins[admins.length - 1]}`;
  return `Ask ${names}, ${admins.length === 1 ? 'an admin' : 'admins'} here, ${ending}`;
}
