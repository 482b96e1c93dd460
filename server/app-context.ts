import type { AuditRepository } from './audit/audit-repository.ts';
import type { BatchRepository } from './batches/batch-repository.ts';
import type { ServerConfig } from './config.ts';
import type { Database } from './db/database.ts';
import type { FormulaStore } from './formulas/formula-store.ts';
import type { PeopleRepository } from './people/people-repository.ts';

/** What the routers share: settings, the database and the repositories. */
export interface AppContext {
  readonly config: ServerConfig;
  readonly db: Database;
  readonly people: PeopleRepository;
  readonly audit: AuditRepository;
  readonly formulas: FormulaStore;
  readonly batches: BatchRepository;
}
