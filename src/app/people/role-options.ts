import { Role } from '../core/api/api-types';

/** A role as the People area offers it: its name and what it allows, in our words. */
export interface RoleOption {
  readonly value: Role;
  readonly label: string;
  readonly description: string;
}

/** The three roles, most powerful first. */
export const ROLE_OPTIONS: readonly RoleOption[] = [
  { value: 'admin', label: 'Admin', description: 'People, formulas and everything else' },
  { value: 'cook', label: 'Cook', description: 'Runs and records batches, reads formulas' },
  { value: 'reviewer', label: 'Reviewer', description: 'Reads everything, signs batches off' },
];

const LABELS = new Map<Role, string>(ROLE_OPTIONS.map((option) => [option.value, option.label]));

/** The name of a role in words. */
export function roleLabel(role: Role): string {
  return LABELS.get(role) ?? role;
}
