import type { AppContext } from './app-context.ts';
import { AuditRepository } from './audit/audit-repository.ts';
import { BatchRepository } from './batches/batch-repository.ts';
import type { ServerConfig } from './config.ts';
import { openDatabase } from './db/database.ts';
import { FormulaStore } from './formulas/formula-store.ts';
import { InvitationRepository } from './invitations/invitation-repository.ts';
import { openMail } from './mail/mail-service.ts';
import { PeopleRepository } from './people/people-repository.ts';
import { ReminderPrefsRepository } from './reminders/reminder-prefs-repository.ts';

/**
 * Opens the database and builds the repositories the routers share; used by main and the tests.
 * `now` is the clock of invitations, reminders and the outbox (tests pass their own).
 */
export async function openContext(
  config: ServerConfig,
  { now = () => new Date() }: { now?: () => Date } = {},
): Promise<AppContext> {
  const db = await openDatabase(config.databaseFile, { busyTimeoutMs: config.busyTimeoutMs });
  const audit = new AuditRepository(db);
  return {
    config,
    db,
    people: new PeopleRepository(db),
    audit,
    formulas: new FormulaStore(config.formulasDir, { watch: true }),
    batches: new BatchRepository(db, audit, config.workflow),
    mail: openMail(db, config, now),
    invitations: new InvitationRepository(db, now),
    reminderPrefs: new ReminderPrefsRepository(db),
    now,
  };
}
