import path from 'node:path';
import type { AppContext } from './app-context.ts';
import { AuditRepository } from './audit/audit-repository.ts';
import { CalcAnswers } from './calc/calc-answers.ts';
import { BatchRepository } from './batches/batch-repository.ts';
import { databaseLocation, type ServerConfig } from './config.ts';
import { openDatabase } from './db/database.ts';
import { FormulaHistory } from './formulas/formula-history.ts';
import { FormulaStore } from './formulas/formula-store.ts';
import { removeStaleTemporaries } from './formulas/stale-temporaries.ts';
import { InvitationRepository } from './invitations/invitation-repository.ts';
import { openMail } from './mail/mail-service.ts';
import { PeopleRepository } from './people/people-repository.ts';
import { ReminderPrefsRepository } from './reminders/reminder-prefs-repository.ts';
import { Records } from './records/records.ts';

/**
 * Opens the database and builds the repositories the routers share; used by main and the tests.
 * `now` is the clock of invitations, reminders, the outbox and the batch routes (tests pass their
 * own). First removes what saves killed mid-way left in the formulas folder, and logs it.
 */
export async function openContext(
  config: ServerConfig,
  { now = () => new Date() }: { now?: () => Date } = {},
): Promise<AppContext> {
  for (const name of await removeStaleTemporaries(config.formulasDir)) {
    // eslint-disable-next-line no-console -- the server log is where someone looks for this
    console.log(
      `Removed ${path.join(config.formulasDir, name)}: left over from a formula save that did not finish`,
    );
  }
  const db = await openDatabase(databaseLocation(config), { busyTimeoutMs: config.busyTimeoutMs });
  const audit = new AuditRepository(db);
  const people = new PeopleRepository(db);
  const formulas = new FormulaStore(config.formulasDir, { watch: true });
  const batches = new BatchRepository(db, audit, config.workflow);
  // Reading through the history records the revision a batch is made from, if it is new on disk.
  const history = new FormulaHistory(formulas, db, audit);
  return {
    config,
    db,
    people,
    audit,
    formulas,
    batches,
    records: new Records({ db, audit, people, batches, history }),
    mail: openMail(db, config, now),
    invitations: new InvitationRepository(db, now),
    reminderPrefs: new ReminderPrefsRepository(db),
    now,
    calcAnswers: new CalcAnswers(config.calcCacheEntries),
  };
}
