import type {
  MessageKind,
  OutboxSummary,
  TransportName,
} from '../../../shared/api/outbox-message.ts';

export type {
  MessageKind,
  OutboxMessage,
  OutboxPage,
  OutboxState,
  OutboxSummary,
  TransportName,
} from '../../../shared/api/outbox-message.ts';

/** The states a reader tells apart: waiting, being handed over, sent, given up on, kept here. */
export type DeliveryTone = 'queued' | 'sending' | 'sent' | 'failed' | 'kept';

/** A message's delivery in words. */
export interface DeliveryStatus {
  readonly tone: DeliveryTone;
  /** One or two words: "Queued", "Sent". */
  readonly label: string;
  /** What the transport said, or why it failed; empty when there is nothing to add. */
  readonly detail: string;
}

const KIND_WORDS: Readonly<Record<MessageKind, string>> = {
  invitation: 'Invitation',
  'reminder-flip': 'Reminder: flip',
  'reminder-ready': 'Reminder: ready',
  'reminder-overdue': 'Reminder: overdue',
  'process-alert': 'Process alert',
};

/**
 * What kind of message it is, in words.
 * @param kind The server's kind.
 * @returns "Invitation", "Reminder: flip"…; an unknown kind comes back as the server wrote it.
 */
export function kindText(kind: string): string {
  return KIND_WORDS[kind as MessageKind] ?? kind;
}

/**
 * Where a message is, in words: queued (with the last failure when it will be tried again),
 * sending, sent (with what the mail server said), failed (with why) or kept here (no mail server
 * is set up: it never left, and is never called sent).
 * @param message The state, tries and result of a message.
 */
export function deliveryStatus(
  message: Pick<OutboxSummary, 'state' | 'attempts' | 'result'>,
): DeliveryStatus {
  const result = message.result?.trim() ?? '';
  switch (message.state) {
    case 'pending':
      return message.attempts > 0
        ? { tone: 'queued', label: 'Queued, will retry', detail: result }
        : { tone: 'queued', label: 'Queued', detail: '' };
    case 'sending':
      return { tone: 'sending', label: 'Sending', detail: '' };
    case 'sent':
      return { tone: 'sent', label: 'Sent', detail: result };
    case 'failed':
      return { tone: 'failed', label: 'Failed', detail: result || 'no reason was given' };
    case 'kept':
      return { tone: 'kept', label: 'Kept here', detail: 'not sent: no mail server is set up' };
    default:
      return { tone: 'queued', label: String(message.state), detail: result };
  }
}

/**
 * Who a message went to, as a mail program writes it: "Wren Ollivane <wren@example.com>".
 * @param message The address and name of the recipient.
 */
export function recipientText(message: Pick<OutboxSummary, 'to' | 'toName'>): string {
  const name = message.toName?.trim();
  return name ? `${name} <${message.to}>` : message.to;
}

/**
 * One line on where messages go, in an admin's words: with no mail server set up they are kept
 * here and nobody receives them.
 * @param transport The server's transport, or null before the first page has come back.
 */
export function transportText(transport: TransportName | null): string {
  if (transport === 'smtp')
    return 'Messages go out through the kitchen’s mail server; once an invitation is sent, its link is removed from the copy kept here.';
  if (transport === 'local')
    return 'Kept here — no mail server is set up, so nothing is sent and nobody receives these messages. Invitation links are shown once, to the admin who sends the invitation, and are not kept here: that admin passes them on.';
  return '';
}

/**
 * Where an invitation's link went, for the message's page: the copy kept here has none.
 * @param message The kind of message and how it went out.
 * @returns A sentence for an invitation; empty for any other message.
 */
export function invitationNote(message: Pick<OutboxSummary, 'kind' | 'transport'>): string {
  if (message.kind !== 'invitation') return '';
  if (message.transport === 'local')
    return 'The link in this invitation was shown once to the admin who sent the invitation, to pass on by hand, and is not kept here. If it got lost, send a new invitation from People.';
  return 'The link in this invitation goes only to the person invited, and is not kept here once the mail server has the message. If it got lost, send a new invitation from People.';
}
