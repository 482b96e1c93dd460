import type { Role } from '../../shared/api/person.ts';

/**
 * Who sees costs and works out least-cost blends: admins and reviewers, the kitchen's managers.
 * What a kitchen pays its suppliers is commonly kept from the line (common practice, no source);
 * cooks weigh and record the batches, and a cost on the cook's sheet would only be in the way.
 */
export const COST_ROLES: readonly Role[] = ['admin', 'reviewer'];
