import type { Role } from '../../shared/api/person.ts';

/** The roles that produce the HACCP records report: those who review records. */
export const REPORT_ROLES: readonly Role[] = ['admin', 'reviewer'];
