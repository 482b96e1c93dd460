import { randomBytes } from 'node:crypto';
import { QueryTypes, type Transaction } from 'sequelize';
import { insertNew } from '../db/insert-row.ts';
import type { Database } from '../db/database.ts';
import type {
  MessageKind,
  OutboxMessage,
  OutboxState,
  OutboxSummary,
  TransportName,
} from '../../shared/api/outbox-message.ts';
import type { Delivery } from './mailer.ts';
import type { MessageContent, OutgoingMessage } from './mail-message.ts';

/** A message to put in the outbox. */
export interface OutboxEntry extends MessageContent {
  readonly to: { readonly address: string; readonly name: string | null };
  readonly personId: number | null;
  readonly kind: MessageKind;
  /** What it is about: a lot code, a username. */
  readonly related: string | null;
}

interface OutboxRow {
  id: number;
  created_at: string;
  to_address: string;
  to_name: string | null;
  subject: string;
  text: string;
  html: string;
  kind: MessageKind;
  related: string | null;
  message_id: string;
  transport: TransportName;
  state: OutboxState;
  attempts: number;
  last_attempt_at: string | null;
  sent_at: string | null;
  result: string | null;
}

const SUMMARY_COLUMNS = `id, created_at, to_address, to_name, subject, kind, related, transport, state,
  attempts, sent_at, result`;

function toSummary(row: OutboxRow): OutboxSummary {
  // The local transport finishes a message as 'sent' (the table's states are the queue's), but
  // nothing left this machine: readers are told it is kept here, never that it was sent.
  const kept = row.transport === 'local' && row.state === 'sent';
  return {
    id: row.id,
    createdAt: row.created_at,
    to: row.to_address,
    toName: row.to_name,
    subject: row.subject,
    kind: row.kind,
    related: row.related,
    transport: row.transport,
    state: kept ? 'kept' : row.state,
    attempts: row.attempts,
    sentAt: kept ? null : row.sent_at,
    result: row.result,
  };
}

/** How often a message is tried before it is given up on. */
export const MAX_ATTEMPTS = 5;
/** The wait before trying a failed message again, doubled after each try: 5, 10, 20, 40 minutes. */
const RETRY_BASE_MS = 5 * 60_000;

// Invitation links carry a password-setting token. The stored copy keeps it only while a mail
// server still has to be handed the message; with no mail server it is never stored at all (the
// admin who sent the invitation is shown the link once instead), and no answer ever reads it.
const TOKEN_IN_LINK = /token=[A-Za-z0-9_-]+/g;
const TOKEN_WORDS = {
  sent: 'token=(removed once the message was sent)',
  failed: 'token=(removed: the message could not be sent)',
  local: 'token=(shown once to the admin who sent the invitation)',
  waiting: 'token=(kept only until the mail server has the message)',
} as const;

/** A message's bodies with every invitation token in them replaced by words. */
function withoutToken<T extends { text: string; html: string }>(
  message: T,
  why: keyof typeof TOKEN_WORDS,
): T {
  const words = TOKEN_WORDS[why];
  return {
    ...message,
    text: message.text.replace(TOKEN_IN_LINK, words),
    html: message.html.replace(TOKEN_IN_LINK, words),
  };
}

/**
 * The outbox: every message, written inside the transaction of whatever caused it (so a message
 * exists exactly when its cause does), then handed to the transport by MailDelivery. Messages
 * are never deleted; each keeps its delivery result.
 */
export class OutboxRepository {
  constructor(
    private readonly db: Database,
    private readonly transport: TransportName,
    /** The domain of Message-IDs: the sender's own. */
    private readonly idDomain: string,
    private readonly now: () => Date,
  ) {}

  /**
   * Puts a message in the outbox inside the caller's transaction; returns its id. With no mail
   * server an invitation is stored without its link's token: nothing will send it anywhere.
   */
  async enqueue(transaction: Transaction, given: OutboxEntry): Promise<number> {
    const entry =
      this.transport === 'local' && given.kind === 'invitation'
        ? withoutToken(given, 'local')
        : given;
    const messageId = `<${randomBytes(12).toString('hex')}.larderbook@${this.idDomain}>`;
    return insertNew(
      this.db,
      `INSERT INTO outbox (created_at, to_address, to_name, person_id, subject, text, html, kind,
         related, message_id, transport, state)
       VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, 'pending')`,
      [
        this.now().toISOString(),
        entry.to.address,
        entry.to.name,
        entry.personId,
        entry.subject,
        entry.text,
        entry.html,
        entry.kind,
        entry.related,
        messageId,
        this.transport,
      ],
      transaction,
    );
  }

  /** The newest messages first, `limit` at a time, before the message with id `before`. */
  async list(options: { limit: number; before?: number }): Promise<OutboxSummary[]> {
    const rows = await this.db.sequelize.query<OutboxRow>(
      `SELECT ${SUMMARY_COLUMNS} FROM outbox ${options.before === undefined ? '' : 'WHERE id < ?'}
       ORDER BY id DESC LIMIT ?`,
      {
        replacements:
          options.before === undefined ? [options.limit] : [options.before, options.limit],
        type: QueryTypes.SELECT,
      },
    );
    return rows.map(toSummary);
  }

  /**
   * One message with its bodies, or undefined. An invitation still waiting for the mail server
   * is read without its token: the link is for the person invited, not for whoever reads here.
   */
  async get(id: number): Promise<OutboxMessage | undefined> {
    const [row] = await this.db.sequelize.query<OutboxRow>('SELECT * FROM outbox WHERE id = ?', {
      replacements: [id],
      type: QueryTypes.SELECT,
    });
    return row
      ? withoutToken(
          { ...toSummary(row), messageId: row.message_id, text: row.text, html: row.html },
          'waiting',
        )
      : undefined;
  }

  /** The ids of messages due to be handed over now: never tried, or waited long enough since. */
  async due(limit: number): Promise<number[]> {
    const rows = await this.db.sequelize.query<
      Pick<OutboxRow, 'id' | 'attempts' | 'last_attempt_at'>
    >(
      "SELECT id, attempts, last_attempt_at FROM outbox WHERE state = 'pending' ORDER BY id LIMIT ?",
      { replacements: [limit], type: QueryTypes.SELECT },
    );
    const now = this.now().getTime();
    return rows
      .filter(
        (row) =>
          row.last_attempt_at === null ||
          Date.parse(row.last_attempt_at) + RETRY_BASE_MS * 2 ** (row.attempts - 1) <= now,
      )
      .map((row) => row.id);
  }

  /**
   * Marks a pending message as being sent and returns it, or undefined when someone else took
   * it first (another run, another process): the claim is one UPDATE under the write lock.
   */
  async claim(id: number): Promise<OutgoingMessage | undefined> {
    return this.db.write(async (transaction) => {
      const [row] = await this.db.sequelize.query<OutboxRow>(
        "SELECT * FROM outbox WHERE id = ? AND state = 'pending'",
        { replacements: [id], type: QueryTypes.SELECT, transaction },
      );
      if (!row) return undefined;
      await this.db.sequelize.query(
        "UPDATE outbox SET state = 'sending', attempts = attempts + 1, last_attempt_at = ? WHERE id = ?",
        { replacements: [this.now().toISOString(), id], transaction },
      );
      return {
        to: { address: row.to_address, name: row.to_name },
        subject: row.subject,
        text: row.text,
        html: row.html,
        messageId: row.message_id,
      };
    });
  }

  /**
   * Records what the transport said: sent; or back to pending for another try later; or failed
   * for good (a permanent refusal, or the last try). An invitation sent, or given up on, loses
   * its token from the stored copy: nothing needs it any more.
   */
  async finish(id: number, delivery: Delivery): Promise<OutboxState> {
    return this.db.write(async (transaction) => {
      const [row] = await this.db.sequelize.query<OutboxRow>('SELECT * FROM outbox WHERE id = ?', {
        replacements: [id],
        type: QueryTypes.SELECT,
        transaction,
      });
      if (!row) return 'failed';
      const state: OutboxState = delivery.ok
        ? 'sent'
        : delivery.permanent || row.attempts >= MAX_ATTEMPTS
          ? 'failed'
          : 'pending';
      const kept =
        state !== 'pending' && row.kind === 'invitation'
          ? withoutToken(row, state === 'sent' ? 'sent' : 'failed')
          : row;
      await this.db.sequelize.query(
        `UPDATE outbox SET state = ?, result = ?, sent_at = ?, text = ?, html = ? WHERE id = ?`,
        {
          replacements: [
            state,
            delivery.ok ? delivery.response : `${delivery.response} (try ${row.attempts})`,
            state === 'sent' ? this.now().toISOString() : null,
            kept.text,
            kept.html,
            id,
          ],
          transaction,
        },
      );
      return state;
    });
  }

  /**
   * After a crash while a message was being handed over: put it back in the queue. The mail
   * server may have taken it before the crash, so it may arrive twice, with the same
   * Message-ID; better than never.
   */
  async recover(): Promise<void> {
    await this.db.write((transaction) =>
      this.db.sequelize.query("UPDATE outbox SET state = 'pending' WHERE state = 'sending'", {
        transaction,
      }),
    );
  }
}
