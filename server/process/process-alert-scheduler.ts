import { QueryTypes, type Transaction } from 'sequelize';
import type { AppContext } from '../app-context.ts';
import { insertRow } from '../db/insert-row.ts';
import { PeriodicRun } from '../reminders/periodic-run.ts';
import type { ProcessDeps } from './judge-and-open.ts';
import { judgeBatch } from './judge-batch.ts';
import { kitchenClock } from './kitchen-clock.ts';
import type { ProcessJobOptions } from './process-job-options.ts';
import { processAlertMessage } from './process-alert-message.ts';
import { batchAlerts, type ProcessAlert } from './process-alerts.ts';
import { BEING_MADE, type ProcessBatch } from './process-repository.ts';
import { deliveryFact } from '../mail/mail-service.ts';
import { kitchenAt, messageSite } from '../mail/message-site.ts';

/** How often alerts are decided: a cooling deadline is to the minute. common practice, no source */
export const ALERT_EVERY_MS = 60_000;
/** How far back a deviation still open is alerted: a server started on an old database does not mail its history. */
export const DEVIATION_ALERT_WINDOW_MS = 24 * 60 * 60_000;

/** An alert one run sent, and to whom (usernames; empty when nobody wants them). */
export interface SentAlert {
  readonly key: string;
  readonly kind: ProcessAlert['kind'];
  readonly recipients: readonly string[];
}

interface DeviationRow {
  id: number;
  batch_id: number | null;
  equipment_id: number | null;
  what: string;
  opened_at: string;
  lot_code: string | null;
  formula_title: string | null;
  equipment_name: string | null;
  equipment_kind: string | null;
}

/** Deviations opened since a moment with no corrective action yet: the deviations_opened index. */
const OPEN_SINCE_SQL = `SELECT d.id, d.batch_id, d.equipment_id, d.what, d.opened_at,
    b.lot_code, b.formula_title, e.name AS equipment_name, e.kind AS equipment_kind
  FROM deviations d LEFT JOIN batches b ON b.id = d.batch_id LEFT JOIN equipment e ON e.id = d.equipment_id
  WHERE d.opened_at >= ? AND NOT EXISTS (SELECT 1 FROM corrective_actions a WHERE a.deviation_id = d.id)
  ORDER BY d.opened_at, d.id`;

function deviationAlert(row: DeviationRow): ProcessAlert {
  return {
    kind: 'deviation',
    key: `deviation ${row.id}`,
    batchId: row.batch_id,
    equipmentId: row.equipment_id,
    subject: row.lot_code ?? row.equipment_name ?? `deviation ${row.id}`,
    title: row.formula_title ?? row.equipment_kind ?? '',
    what: row.what,
    at: row.opened_at,
  };
}

/**
 * Sends process alerts through the outbox: a reading overdue, a cooling stage within 30 minutes
 * of its deadline, a deviation opened; at start, then every minute. Each alert is decided once:
 * its process_alerts_sent row (UNIQUE on its dedupe key), its outbox messages and its audit entry
 * are one write, which first inserts the row and sends nothing when the row was already there.
 * So no alert goes twice — from this process, after a restart, or from a second server on the same
 * database — and none is lost: a crash before the commit leaves nothing, and the next run sends it.
 */
export class ProcessAlertScheduler extends PeriodicRun<SentAlert[]> {
  private readonly now: () => Date;

  constructor(
    private readonly context: AppContext,
    private readonly deps: ProcessDeps,
    options: ProcessJobOptions = {},
  ) {
    super(options.intervalMs ?? ALERT_EVERY_MS, options.report);
    this.now = options.now ?? context.now;
  }

  /** Every alert owed now: the batches being made, judged; the deviations still open. */
  private async owed(at: string): Promise<{ alert: ProcessAlert; batch?: ProcessBatch }[]> {
    const { process, db } = this.deps;
    const owed: { alert: ProcessAlert; batch?: ProcessBatch }[] = [];
    for (const batch of await process.beingMade()) {
      const controls = await process.controlsOf(batch);
      if (controls.length === 0) continue;
      const judged = judgeBatch(
        controls,
        await process.readings(batch.id),
        batch.status,
        kitchenClock(at),
      );
      for (const alert of batchAlerts(batch, judged, at)) owed.push({ alert, batch });
    }
    const since = new Date(Date.parse(at) - DEVIATION_ALERT_WINDOW_MS).toISOString();
    const open = await db.sequelize.query<DeviationRow>(OPEN_SINCE_SQL, {
      replacements: [since],
      type: QueryTypes.SELECT,
    });
    for (const row of open) owed.push({ alert: deviationAlert(row) });
    return owed;
  }

  protected async run(): Promise<SentAlert[]> {
    const at = this.now().toISOString();
    const owed = await this.owed(at);
    const sent: SentAlert[] = [];
    if (owed.length === 0) return sent;
    const keys = owed.map(({ alert }) => alert.key);
    const done = new Set(
      (
        await this.deps.db.sequelize.query<{ dedupe_key: string }>(
          `SELECT dedupe_key FROM process_alerts_sent WHERE dedupe_key IN (${keys.map(() => '?').join(', ')})`,
          { replacements: keys, type: QueryTypes.SELECT },
        )
      ).map((row) => row.dedupe_key),
    );
    for (const { alert, batch } of owed) {
      if (done.has(alert.key)) continue;
      const recipients = await this.deps.db.write((t) => this.send(t, alert, batch, at));
      if (recipients) sent.push({ key: alert.key, kind: alert.kind, recipients });
    }
    this.context.mail.delivery.kick();
    return sent;
  }

  /** Whether a batch alert is still owed under the write lock: a reading may have come in. */
  private async stillOwed(t: Transaction, alert: ProcessAlert, batch: ProcessBatch, at: string) {
    const { process } = this.deps;
    const current = await process.batch(batch.lotCode, t);
    if (!BEING_MADE.includes(current.status)) return false;
    const judged = judgeBatch(
      await process.controlsOf(current),
      await process.readings(current.id, t),
      current.status,
      kitchenClock(at),
    );
    return batchAlerts(current, judged, at).some((owed) => owed.key === alert.key);
  }

  /**
   * Writes one alert: its row first (nothing more when it is there already), then a message to
   * each person who wants process alerts, then its audit entry.
   * @returns the recipients' usernames, or undefined when it was sent already or is no longer owed
   */
  private async send(
    t: Transaction,
    alert: ProcessAlert,
    batch: ProcessBatch | undefined,
    at: string,
  ): Promise<string[] | undefined> {
    const { db, mail, reminderPrefs, audit } = this.context;
    if (batch && !(await this.stillOwed(t, alert, batch, at))) return undefined;
    const site = await messageSite(db, t, alert);
    const recipients = await reminderPrefs.processAlertRecipients(t, site.id);
    const row = await insertRow(
      db,
      t,
      `INSERT INTO process_alerts_sent (dedupe_key, kind, batch_id, equipment_id, sent_at, recipients)
       VALUES (?, ?, ?, ?, ?, ?) ON CONFLICT (dedupe_key) DO NOTHING`,
      [alert.key, alert.kind, alert.batchId, alert.equipmentId, at, recipients.length],
    );
    if (row.changes === 0) return undefined;
    const url = alert.batchId === null ? mail.links.base() : mail.links.batch(alert.subject);
    for (const person of recipients)
      await mail.outbox.enqueue(t, {
        ...processAlertMessage({
          alert,
          now: at,
          recipientName: person.displayName,
          url,
          consoleUrl: mail.links.base(),
          kitchen: kitchenAt(mail.kitchen, site),
          site,
        }),
        to: { address: person.email, name: person.displayName },
        personId: person.id,
        kind: 'process-alert',
        related: alert.subject,
      });
    await audit.append(
      {
        action: 'process-alert-send',
        subject: alert.subject,
        detail: {
          kind: alert.kind,
          key: alert.key,
          what: alert.what,
          to: recipients.map((p) => p.username),
          ...deliveryFact(mail),
        },
      },
      t,
    );
    return recipients.map((p) => p.username);
  }
}
