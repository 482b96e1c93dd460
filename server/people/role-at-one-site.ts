import type { Transaction } from 'sequelize';
import type { Person } from '../../shared/api/person.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { Database } from '../db/database.ts';
import { SiteRepository, type Site } from '../sites/site-repository.ts';
import type { AuditedBy } from './add-person.ts';
import type { PeopleRepository } from './people-repository.ts';

/**
 * Makes a person's role hold at one site only (a cook of one shop): their role there, none at
 * every site, and the change in the audit log, in the transaction that added them, so that they
 * never hold a role anywhere else, not even for a moment.
 * @returns The person as they are now.
 */
export async function holdRoleAtOneSite(
  deps: { db: Database; audit: AuditRepository; people: PeopleRepository },
  transaction: Transaction,
  person: Person,
  site: Site,
  by: AuditedBy,
): Promise<Person> {
  await new SiteRepository(deps.db).setRoles(
    person.id,
    [{ siteId: site.id, role: person.role }],
    transaction,
  );
  const changed = await deps.people.update(person.id, { roleEverywhere: false }, transaction);
  await deps.audit.append(
    {
      ...by,
      action: 'person-change',
      subject: person.username,
      detail: { roleEverywhere: false, sites: [{ key: site.key, role: person.role }] },
    },
    transaction,
  );
  return changed ?? person;
}
