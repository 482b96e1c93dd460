import type { Transaction } from 'sequelize';
import type { Equipment } from '../../shared/api/equipment.ts';
import type { AppContext } from '../app-context.ts';
import { PeriodicRun } from '../reminders/periodic-run.ts';
import { equipmentDueMessage } from './equipment-due-message.ts';
import { EquipmentRows } from './equipment-rows.ts';
import { viewOf } from './equipment-view.ts';
import { insertRow } from '../db/insert-row.ts';
import { deliveryFact } from '../mail/mail-service.ts';
import { kitchenAt, messageSite } from '../mail/message-site.ts';

/**
 * How long after a reading or check falls due it is chased: a cook on their round is not
 * reminded of the reading they are about to take. Our own choice, not an outside figure.
 */
export const DUE_GRACE_MS = 30 * 60_000;

/** How the job runs; tests move its clock. */
export interface EquipmentDueOptions {
  /** The clock; the context's by default. */
  readonly now?: () => Date;
  /** Minutes between runs; LARDER_REMINDER_MINUTES by default. */
  readonly intervalMinutes?: number;
  /** Where a failed run is reported; the server log by default. */
  readonly report?: (error: unknown) => void;
}

/** A reminder one run sent: which equipment, what fell due when, to whom (usernames). */
export interface SentEquipmentDue {
  readonly equipmentId: number;
  readonly name: string;
  readonly dueAt: string;
  readonly recipients: readonly string[];
}

/** The dedupe key of one due reading or check: sent once, across restarts and processes. */
export const dueKey = (equipment: Pick<Equipment, 'id' | 'kind'>, dueAt: string): string =>
  `equipment ${equipment.id}/${equipment.kind === 'thermometer' ? 'ice-point check' : 'reading'} due ${dueAt}`;

/**
 * Reminds, once each, of equipment readings and thermometer checks not taken on time: at start
 * and every few minutes, for each piece in use whose next reading (or ice-point check) fell due
 * more than {@link DUE_GRACE_MS} ago. Each is decided in one write transaction: its
 * process_alerts_sent row (kind 'equipment-due', UNIQUE key naming the equipment and the time it
 * fell due), a message to each person who gets process alerts (as a batch's alerts go), an audit
 * entry. A crash before the commit leaves nothing; after it, the row keeps any run from sending it again.
 */
export class EquipmentDueScheduler extends PeriodicRun<SentEquipmentDue[]> {
  private readonly now: () => Date;
  private readonly rows: EquipmentRows;

  constructor(
    private readonly context: AppContext,
    options: EquipmentDueOptions = {},
  ) {
    super((options.intervalMinutes ?? context.config.reminderMinutes) * 60_000, options.report);
    this.now = options.now ?? context.now;
    this.rows = new EquipmentRows(context.db);
  }

  protected async run(): Promise<SentEquipmentDue[]> {
    const now = this.now();
    const sent: SentEquipmentDue[] = [];
    for (const row of await this.rows.equipment()) {
      if (!row.active) continue;
      const dueAt = (await viewOf(this.rows, row, now)).nextDue;
      if (!isChased(dueAt, now)) continue;
      const done = await this.context.db.write((t) => this.send(t, row.id, now));
      if (done) sent.push(done);
    }
    // Also the moment to try again any message that failed before.
    this.context.mail.delivery.kick();
    return sent;
  }

  /** Writes one reminder, judged again under the write lock; undefined when not owed now. */
  private async send(t: Transaction, id: number, now: Date): Promise<SentEquipmentDue | undefined> {
    const { db, mail, reminderPrefs, audit } = this.context;
    const [row] = await this.rows.equipment(id, t);
    if (!row?.active) return undefined;
    const equipment = await viewOf(this.rows, row, now, t);
    const dueAt = equipment.nextDue;
    if (!dueAt || !isChased(dueAt, now)) return undefined;
    const site = await messageSite(db, t, { equipmentId: id });
    const recipients = await reminderPrefs.processAlertRecipients(t, site.id);
    const inserted = await insertRow(
      db,
      t,
      `INSERT INTO process_alerts_sent (dedupe_key, kind, equipment_id, sent_at, recipients)
       VALUES (?, 'equipment-due', ?, ?, ?) ON CONFLICT (dedupe_key) DO NOTHING`,
      [dueKey(equipment, dueAt), id, now.toISOString(), recipients.length],
    );
    if (inserted.changes === 0) return undefined;
    for (const person of recipients) {
      const content = equipmentDueMessage({
        equipment,
        dueAt,
        recipientName: person.displayName,
        equipmentUrl: `${mail.links.base()}/equipment`,
        consoleUrl: mail.links.base(),
        kitchen: kitchenAt(mail.kitchen, site),
        site,
      });
      await mail.outbox.enqueue(t, {
        ...content,
        to: { address: person.email, name: person.displayName },
        personId: person.id,
        // A reading or check of the kitchen's equipment not taken on time is a process alert.
        kind: 'process-alert',
        related: equipment.name,
      });
    }
    const to = recipients.map((p) => p.username);
    await audit.append(
      {
        action: 'process-alert-send',
        subject: equipment.name,
        detail: { kind: 'equipment-due', equipment: id, dueAt, to, ...deliveryFact(mail) },
      },
      t,
    );
    return { equipmentId: id, name: equipment.name, dueAt, recipients: to };
  }
}

/** Whether a reading or check due at `dueAt` is owed a reminder at `now`. */
function isChased(dueAt: string | null, now: Date): dueAt is string {
  return dueAt !== null && Date.parse(dueAt) + DUE_GRACE_MS <= now.getTime();
}
