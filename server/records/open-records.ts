import path from 'node:path';
import { AuditRepository } from '../audit/audit-repository.ts';
import { BatchRepository } from '../batches/batch-repository.ts';
import { databaseLocation, type ServerConfig } from '../config.ts';
import { openDatabase } from '../db/database.ts';
import { FormulaHistory } from '../formulas/formula-history.ts';
import { FormulaStore } from '../formulas/formula-store.ts';
import { PeopleRepository } from '../people/people-repository.ts';
import { Records } from './records.ts';

/**
 * Opens the database of these settings and builds the records over it, the formulas read from
 * `formulasFolder` (default: the settings' own). The database stack loads with this module.
 */
export async function openLocalRecords(
  config: ServerConfig,
  formulasFolder: string = config.formulasDir,
): Promise<Records> {
  const db = await openDatabase(databaseLocation(config));
  const audit = new AuditRepository(db);
  return new Records({
    db,
    audit,
    people: new PeopleRepository(db),
    batches: new BatchRepository(db, audit, config.workflow),
    history: new FormulaHistory(new FormulaStore(path.resolve(formulasFolder)), db, audit),
  });
}
