/**
 * The e-mail outbox as GET /api/outbox answers: one definition for the server that keeps it and
 * the console that shows it (as types only).
 */

/** What Larderbook sends: an invitation, one of the three reminders, or a process alert. */
export const MESSAGE_KINDS = [
  'invitation',
  'reminder-flip',
  'reminder-ready',
  'reminder-overdue',
  'process-alert',
] as const;

/** One of {@link MESSAGE_KINDS}. */
export type MessageKind = (typeof MESSAGE_KINDS)[number];

/**
 * Where a message is: waiting, being handed over, handed over to the mail server, given up on,
 * or kept (with no mail server set up it was written and stays in the outbox: it did not leave).
 */
export type OutboxState = 'pending' | 'sending' | 'sent' | 'failed' | 'kept';

/** Where messages go: kept in the local outbox only, or handed to a mail server. */
export type TransportName = 'local' | 'smtp';

/** A message as the outbox list shows it (GET /api/outbox). */
export interface OutboxSummary {
  readonly id: number;
  /** When it was put in the outbox (ISO 8601). */
  readonly createdAt: string;
  readonly to: string;
  readonly toName: string | null;
  readonly subject: string;
  readonly kind: MessageKind;
  /** What it is about: a lot code, a username. */
  readonly related: string | null;
  readonly transport: TransportName;
  readonly state: OutboxState;
  readonly attempts: number;
  /** When the mail server took it; null until then, and always for a message kept here. */
  readonly sentAt: string | null;
  /** The transport's answer, or why it failed. */
  readonly result: string | null;
}

/** One message with its bodies (GET /api/outbox/:id). */
export interface OutboxMessage extends OutboxSummary {
  readonly messageId: string;
  readonly text: string;
  readonly html: string;
}

/** One page of the outbox; `next` is the `before` of the following page, null at the end. */
export interface OutboxPage {
  readonly messages: readonly OutboxSummary[];
  readonly next: number | null;
  readonly transport: TransportName;
}
