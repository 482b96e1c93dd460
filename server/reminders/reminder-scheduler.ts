import { QueryTypes, type Transaction } from 'sequelize';
import type { AppContext } from '../app-context.ts';
import type { BatchStatus } from '../../shared/api/batch-record.ts';
import { jsonAt } from '../db/dialect-sql.ts';
import { PeriodicRun } from './periodic-run.ts';
import { reminderMessage, type RemindedBatch } from './reminder-message.ts';
import {
  dueReminders,
  localDate,
  type DueReminder,
  type HoldDates,
  type ReminderKind,
} from './reminder-schedule.ts';
import { deliveryFact } from '../mail/mail-service.ts';
import { kitchenAt, messageSite } from '../mail/message-site.ts';

/** The statuses that are a hold: a cure curing, a dough proofing. */
const HELD: readonly BatchStatus[] = ['curing', 'proofing'];

/** How the scheduler runs; tests move its clock. */
export interface ReminderSchedulerOptions {
  /** The clock; the context's by default. */
  readonly now?: () => Date;
  /** Minutes between runs; LARDER_REMINDER_MINUTES by default. */
  readonly intervalMinutes?: number;
  /** Where a failed run is reported; the server log by default. */
  readonly report?: (error: unknown) => void;
}

/** A reminder one run sent, to whom (usernames; empty when nobody wanted it). */
export interface SentReminder extends DueReminder {
  readonly lotCode: string;
  readonly recipients: readonly string[];
}

/** What one run did. */
export interface ReminderRun {
  /** The day it ran for, in the server's time zone. */
  readonly today: string;
  readonly sent: readonly SentReminder[];
}

interface HeldRow {
  id: number;
  lot_code: string;
  formula_title: string;
  status: 'curing' | 'proofing';
  started_on: string;
  ready_on: string | null;
  recorded_at: string;
  schedule_start: string | null;
  schedule_ready: string | null;
  flip_every_days: number | null;
  last_turned_on: string | null;
}

/**
 * The hold's dates: the result's schedule, or for a batch with only a ready date, that; with the
 * day it was recorded on, before which nothing is due.
 */
function holdOf(row: HeldRow): HoldDates | undefined {
  const recordedOn = localDate(new Date(row.recorded_at));
  if (row.schedule_start && row.schedule_ready)
    return {
      start: row.schedule_start,
      ready: row.schedule_ready,
      flipEveryDays: row.flip_every_days,
      recordedOn,
      lastTurnedOn: row.last_turned_on,
    };
  return row.ready_on ? { start: row.started_on, ready: row.ready_on, recordedOn } : undefined;
}

const key = (batchId: number, kind: ReminderKind, dueOn: string): string =>
  `${batchId}|${kind}|${dueOn}`;

/**
 * Sends flip, ready and overdue reminders for the batches curing or proofing: at start, then
 * every few minutes. Each reminder (batch, kind, day) is decided once: its reminders_sent row
 * (UNIQUE on those three) and its outbox messages are written in one write transaction, which
 * first checks that the row is not there and the batch is still held. A crash before the commit
 * leaves nothing, so the next run sends it; after the commit the row is there, so no run, in
 * this process or after a restart, sends it again. The outbox then delivers the messages.
 */
export class ReminderScheduler extends PeriodicRun<ReminderRun> {
  private readonly now: () => Date;

  constructor(
    private readonly context: AppContext,
    options: ReminderSchedulerOptions = {},
  ) {
    super((options.intervalMinutes ?? context.config.reminderMinutes) * 60_000, options.report);
    this.now = options.now ?? context.now;
  }

  protected async run(): Promise<ReminderRun> {
    const { db, mail } = this.context;
    const today = localDate(this.now());
    const held = await db.sequelize.query<HeldRow>(
      `SELECT id, lot_code, formula_title, status, started_on, ready_on, recorded_at,
         ${jsonAt(db.dialect, 'result', ['schedule', 'start'], 'text')} AS schedule_start,
         ${jsonAt(db.dialect, 'result', ['schedule', 'ready'], 'text')} AS schedule_ready,
         ${jsonAt(db.dialect, 'result', ['schedule', 'flipEveryDays'], 'integer')} AS flip_every_days,
         (SELECT MAX(turned_on) FROM batch_turns t WHERE t.batch_id = batches.id) AS last_turned_on
       FROM batches WHERE status IN ('curing', 'proofing') ORDER BY id`,
      { type: QueryTypes.SELECT },
    );
    const done = new Set(
      (
        await db.sequelize.query<{ batch_id: number; kind: ReminderKind; due_on: string }>(
          `SELECT r.batch_id, r.kind, r.due_on FROM reminders_sent r
           JOIN batches b ON b.id = r.batch_id WHERE b.status IN ('curing', 'proofing')`,
          { type: QueryTypes.SELECT },
        )
      ).map((r) => key(r.batch_id, r.kind, r.due_on)),
    );
    const sent: SentReminder[] = [];
    for (const row of held) {
      const hold = holdOf(row);
      if (!hold) continue;
      for (const due of dueReminders(hold, today)) {
        if (done.has(key(row.id, due.kind, due.dueOn))) continue;
        const batch: RemindedBatch = {
          ...hold,
          lotCode: row.lot_code,
          title: row.formula_title,
          status: row.status,
        };
        const recipients = await db.write((t) => this.send(t, row.id, batch, due, today));
        if (recipients) sent.push({ ...due, lotCode: row.lot_code, recipients });
      }
    }
    // Also the moment to try again any message that failed before.
    mail.delivery.kick();
    return { today, sent };
  }

  /**
   * Writes one reminder: its row, a message to each person who wants it, an audit entry.
   * @returns the recipients' usernames, or undefined when it was sent already, the batch is no
   *   longer held or (a turn reminder) was turned for since (checked under the write lock)
   */
  private async send(
    t: Transaction,
    batchId: number,
    batch: RemindedBatch,
    due: DueReminder,
    today: string,
  ): Promise<string[] | undefined> {
    const { db, mail, reminderPrefs, audit } = this.context;
    const select = <T extends object>(sql: string, values: unknown[]): Promise<T[]> =>
      db.sequelize.query<T>(sql, { replacements: values, type: QueryTypes.SELECT, transaction: t });
    const [current] = await select<{ status: BatchStatus }>(
      'SELECT status FROM batches WHERE id = ?',
      [batchId],
    );
    if (!current || !HELD.includes(current.status)) return undefined;
    const [already] = await select<{ id: number }>(
      'SELECT id FROM reminders_sent WHERE batch_id = ? AND kind = ? AND due_on = ?',
      [batchId, due.kind, due.dueOn],
    );
    if (already) return undefined;
    // A turn recorded since the run read the batches settles its turn reminder all the same.
    if (due.kind === 'flip') {
      const [turned] = await select<{ id: number }>(
        'SELECT id FROM batch_turns WHERE batch_id = ? AND turned_on >= ? LIMIT 1',
        [batchId, due.dueOn],
      );
      if (turned) return undefined;
    }
    const site = await messageSite(db, t, { batchId });
    const recipients = await reminderPrefs.recipients(t, due.kind, site.id);
    const at = this.now().toISOString();
    await db.sequelize.query(
      'INSERT INTO reminders_sent (batch_id, kind, due_on, sent_at, recipients) VALUES (?, ?, ?, ?, ?)',
      { replacements: [batchId, due.kind, due.dueOn, at, recipients.length], transaction: t },
    );
    for (const person of recipients) {
      const content = reminderMessage({
        kind: due.kind,
        batch,
        dueOn: due.dueOn,
        today,
        recipientName: person.displayName,
        batchUrl: mail.links.batch(batch.lotCode),
        consoleUrl: mail.links.base(),
        kitchen: kitchenAt(mail.kitchen, site),
        site,
      });
      await mail.outbox.enqueue(t, {
        ...content,
        to: { address: person.email, name: person.displayName },
        personId: person.id,
        kind: `reminder-${due.kind}`,
        related: batch.lotCode,
      });
    }
    await audit.append(
      {
        action: 'reminder-send',
        subject: batch.lotCode,
        detail: {
          kind: due.kind,
          dueOn: due.dueOn,
          to: recipients.map((p) => p.username),
          ...deliveryFact(mail),
        },
      },
      t,
    );
    return recipients.map((p) => p.username);
  }
}
