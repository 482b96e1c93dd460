import type { AppContext } from './app-context.ts';
import { AuditRepository } from './audit/audit-repository.ts';
import type { ServerConfig } from './config.ts';
import { openDatabase } from './db/database.ts';
import { FormulaStore } from './formulas/formula-store.ts';
import { PeopleRepository } from './people/people-repository.ts';

/** Opens the database and builds the repositories the routers share; used by main and the tests. */
export async function openContext(config: ServerConfig): Promise<AppContext> {
  const db = await openDatabase(config.databaseFile);
  return {
    config,
    db,
    people: new PeopleRepository(db),
    audit: new AuditRepository(db),
    formulas: new FormulaStore(config.formulasDir),
  };
}
