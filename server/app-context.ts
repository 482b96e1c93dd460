import type { CalcAnswers } from './calc/calc-answers.ts';
import type { AuditRepository } from './audit/audit-repository.ts';
import type { BatchRepository } from './batches/batch-repository.ts';
import type { ServerConfig } from './config.ts';
import type { Database } from './db/database.ts';
import type { FormulaStore } from './formulas/formula-store.ts';
import type { InvitationRepository } from './invitations/invitation-repository.ts';
import type { MailService } from './mail/mail-service.ts';
import type { PeopleRepository } from './people/people-repository.ts';
import type { ReminderPrefsRepository } from './reminders/reminder-prefs-repository.ts';
import type { Records } from './records/records.ts';

/** What the routers share: settings, the database and the repositories. */
export interface AppContext {
  readonly config: ServerConfig;
  readonly db: Database;
  readonly people: PeopleRepository;
  readonly audit: AuditRepository;
  readonly formulas: FormulaStore;
  readonly batches: BatchRepository;
  /** Record keeping: the one way the routers record and read batches, plans and people. */
  readonly records: Records;
  /** The outbox and its delivery (server/mail). */
  readonly mail: MailService;
  readonly invitations: InvitationRepository;
  readonly reminderPrefs: ReminderPrefsRepository;
  /** The clock of invitations, reminders, the outbox and the batch routes' today; tests move it. */
  readonly now: () => Date;
  /** Finished calculation answers, kept by everything they depend on (POST /api/calc). */
  readonly calcAnswers: CalcAnswers;
}
