import type { AuditAction, AuditEvent } from '../../../shared/api/audit-event.ts';
import { dayWords } from '../../../shared/presentation/date-words.ts';
import { processDetailText } from './audit-process-detail';
import { fieldsOf, join, present, recipientsText, wordsOf } from './audit-words';

export type { AuditAction, AuditEvent, AuditPage } from '../../../shared/api/audit-event.ts';

/** Every action in words, in the order the filter lists them. */
export const AUDIT_ACTIONS: readonly { readonly value: AuditAction; readonly label: string }[] = [
  { value: 'sign-in', label: 'Signed in' },
  { value: 'sign-in-failed', label: 'Sign-in failed' },
  { value: 'sign-in-throttled', label: 'Sign-ins paused after failures' },
  { value: 'sign-out', label: 'Signed out' },
  { value: 'formula-save', label: 'Saved a formula' },
  { value: 'formula-create', label: 'Created a formula' },
  { value: 'formula-upload', label: 'Uploaded a formula' },
  { value: 'formula-disk-change', label: 'Formula file changed on disk' },
  { value: 'batch-record', label: 'Recorded a batch' },
  { value: 'batch-status', label: 'Moved a batch on' },
  { value: 'batch-sign-off', label: 'Signed a batch off' },
  { value: 'batch-turn', label: 'Turned a cure' },
  { value: 'person-add', label: 'Added a person' },
  { value: 'person-change', label: 'Changed a person' },
  { value: 'password-reset', label: 'Reset a password' },
  { value: 'invitation-send', label: 'Sent or kept an invitation' },
  { value: 'reminder-choices', label: 'Chose their reminders' },
  { value: 'reminder-send', label: 'Sent or kept a reminder' },
  { value: 'reading-add', label: 'Took a reading' },
  { value: 'reading-correct', label: 'Corrected a reading' },
  { value: 'readings-upload', label: 'Uploaded a thermometer log' },
  { value: 'weighing-add', label: 'Weighed' },
  { value: 'batch-start', label: 'Started a planned batch' },
  { value: 'deviation-open', label: 'A limit was missed' },
  { value: 'corrective-action', label: 'Recorded a corrective action' },
  { value: 'batch-verify', label: 'Verified and released a batch' },
  { value: 'calculation-refused', label: 'A calculation was refused' },
  { value: 'equipment-add', label: 'Added equipment' },
  { value: 'equipment-change', label: 'Changed equipment' },
  { value: 'calibration-add', label: 'Checked a thermometer' },
  { value: 'process-alert-send', label: 'Sent or kept an alert' },
  { value: 'report-produce', label: 'Produced a HACCP report' },
  { value: 'plan-make', label: 'Made a plan' },
  { value: 'plan-record', label: 'Recorded a plan as planned' },
  { value: 'batch-lots', label: 'Recorded the lots a batch used' },
  { value: 'recall-produce', label: 'Produced a recall report' },
  { value: 'receipt-record', label: 'Received a delivery' },
  { value: 'receipt-discard', label: 'Discarded a received lot' },
];

const ACTION_LABELS = new Map<string, string>(AUDIT_ACTIONS.map((a) => [a.value, a.label]));

/**
 * A message's entry in words: sent, or kept in the outbox when no mail server was set up (the
 * server notes `kept: true`) — never "sent" for a message that did not leave.
 */
const MESSAGE_LABELS: Readonly<Record<string, { sent: string; kept: string }>> = {
  'invitation-send': {
    sent: 'Sent an invitation',
    kept: 'Kept an invitation (no mail server)',
  },
  'reminder-send': { sent: 'Sent a reminder', kept: 'Kept a reminder (no mail server)' },
  'process-alert-send': { sent: 'Sent an alert', kept: 'Kept an alert (no mail server)' },
};

const STATUS_WORDS: Readonly<Record<string, string>> = {
  planned: 'planned',
  'in-progress': 'in progress',
  curing: 'curing',
  proofing: 'proofing',
  done: 'done',
  discarded: 'discarded',
};

/**
 * What happened, in words.
 * @param event An audit entry.
 * @returns A short phrase such as "Signed in"; unknown actions come back as the server wrote them.
 */
export function actionText(event: Pick<AuditEvent, 'action' | 'detail'>): string {
  if (event.action === 'password-reset' && fieldsOf(event.detail)['own'] === true) {
    return 'Changed their own password';
  }
  if (event.action === 'password-reset' && fieldsOf(event.detail)['via'] === 'invitation') {
    return 'Set their password from an invitation';
  }
  const message = MESSAGE_LABELS[event.action];
  if (message) return fieldsOf(event.detail)['kept'] === true ? message.kept : message.sent;
  return ACTION_LABELS.get(event.action) ?? event.action;
}

/**
 * The entry's detail in one line: the facts a reader needs, not the raw JSON.
 * @param event An audit entry.
 * @returns A summary, or an empty string when the entry carries no detail worth showing.
 */
export function detailText(event: Pick<AuditEvent, 'action' | 'detail'>): string {
  const detail = fieldsOf(event.detail);
  switch (event.action) {
    case 'sign-in':
    case 'sign-in-failed':
      return viaText(detail['via']);
    case 'formula-save':
    case 'formula-create':
    case 'formula-upload':
      return join(
        [
          present(detail['message']) ? `“${wordsOf(detail['message'])}”` : '',
          present(detail['revision']) ? `revision ${shortRevision(detail['revision'])}` : '',
          present(detail['previousRevision'])
            ? `was ${shortRevision(detail['previousRevision'])}`
            : '',
          present(detail['uploadedAs']) ? `from the file ${wordsOf(detail['uploadedAs'])}` : '',
        ],
        ' · ',
      );
    case 'formula-disk-change':
      return join(
        [
          present(detail['file']) ? wordsOf(detail['file']) : '',
          present(detail['to'])
            ? `revision ${shortRevision(detail['from'])} → ${shortRevision(detail['to'])}`
            : '',
        ],
        ' · ',
      );
    case 'batch-record':
      return join(
        [
          present(detail['formula']) ? `formula ${wordsOf(detail['formula'])}` : '',
          present(detail['status']) ? `status ${statusText(detail['status'])}` : '',
        ],
        ', ',
      );
    case 'batch-status':
      return join(
        [
          `${statusText(detail['from'])} → ${statusText(detail['to'])}`,
          detail['afterSignOff'] === true ? 'after sign-off' : '',
          present(detail['reason']) ? `reason: ${wordsOf(detail['reason'])}` : '',
        ],
        ' · ',
      );
    case 'batch-sign-off':
      return join(
        [
          present(detail['status']) ? `at status ${statusText(detail['status'])}` : '',
          present(detail['note']) ? `note: ${wordsOf(detail['note'])}` : '',
        ],
        ' · ',
      );
    case 'batch-turn':
      return join(
        [
          present(detail['on']) ? `on ${dayWords(wordsOf(detail['on']))}` : '',
          present(detail['note']) ? `note: ${wordsOf(detail['note'])}` : '',
        ],
        ' · ',
      );
    case 'person-add':
      return present(detail['role']) ? `role ${wordsOf(detail['role'])}` : '';
    case 'person-change':
      return personChangeText(detail);
    case 'invitation-send':
      return present(detail['to']) ? `to ${wordsOf(detail['to'])}` : '';
    case 'reminder-choices':
      return reminderChoicesText(detail);
    case 'reminder-send':
      return join(
        [
          present(detail['kind']) ? `${wordsOf(detail['kind'])} reminder` : '',
          present(detail['dueOn']) ? `due ${dayWords(wordsOf(detail['dueOn']))}` : '',
          recipientsText(detail['to']),
        ],
        ', ',
      );
    case 'plan-make':
    case 'plan-record':
      return planText(detail);
    case 'batch-lots':
      return lotsText(detail);
    case 'sign-in-throttled':
      return join(
        [
          viaText(detail['via']),
          typeof detail['retryAfterSeconds'] === 'number'
            ? `this address may try again in ${Math.ceil(detail['retryAfterSeconds'] / 60)} min`
            : '',
        ],
        '; ',
      );
    case 'password-reset':
    case 'sign-out':
      return '';
    default:
      return processDetailText(event.action, detail) ?? genericText(detail);
  }
}

function personChangeText(detail: Record<string, unknown>): string {
  const parts: string[] = [];
  for (const [key, value] of Object.entries(detail)) {
    if (key === 'active') parts.push(value === false ? 'deactivated' : 'reactivated');
    else if (key === 'role') parts.push(`role → ${wordsOf(value)}`);
    else if (key === 'displayName') parts.push(`name → ${wordsOf(value)}`);
    else if (key === 'email')
      parts.push(present(value) ? `e-mail → ${wordsOf(value)}` : 'e-mail removed');
    else parts.push(`${key} → ${wordsOf(value)}`);
  }
  return parts.join(', ');
}

/** A plan's entry: how many for which service, and for a recording the lots it made. */
function planText(detail: Record<string, unknown>): string {
  const lots = Array.isArray(detail['lots']) ? detail['lots'].map(wordsOf) : undefined;
  return join(
    [
      typeof detail['count'] === 'number' && present(detail['serviceDate'])
        ? `${detail['count']} for the service on ${dayWords(wordsOf(detail['serviceDate']))}`
        : '',
      lots === undefined
        ? ''
        : `${lots.length} ${lots.length === 1 ? 'batch' : 'batches'}${lots.length > 0 ? `: ${lots.join(', ')}` : ''}`,
      detail['again'] === true ? 'recorded again' : '',
    ],
    ' · ',
  );
}

/** The lots a batch used, in words: "used on 3 Dec 2026 · 2 lots: R261201-01, R261202-01". */
function lotsText(detail: Record<string, unknown>): string {
  const lots = Array.isArray(detail['uses'])
    ? [...new Set(detail['uses'].map((use) => wordsOf(fieldsOf(use)['lot'])))]
    : [];
  return join(
    [
      present(detail['usedOn']) ? `used on ${dayWords(wordsOf(detail['usedOn']))}` : '',
      `${lots.length} ${lots.length === 1 ? 'lot' : 'lots'}${lots.length ? `: ${lots.join(', ')}` : ''}`,
      detail['accepted'] === true ? 'as suggested' : '',
      Array.isArray(detail['replaced']) ? 'recorded again' : '',
    ],
    ' · ',
  );
}

function reminderChoicesText(detail: Record<string, unknown>): string {
  const kinds = ['flip', 'ready', 'overdue'].filter((kind) => detail[kind] === true);
  return kinds.length === 0 ? 'no reminders' : kinds.join(', ');
}

function viaText(via: unknown): string {
  if (via === 'form') return 'with the sign-in form';
  if (via === 'basic') return 'from the command line or a script';
  return present(via) ? `via ${wordsOf(via)}` : '';
}

function statusText(status: unknown): string {
  if (!present(status)) return '?';
  const text = wordsOf(status);
  return STATUS_WORDS[text] ?? text;
}

const RECORD_NUMBERS: ReadonlySet<string> = new Set([
  'reading',
  'readings',
  'correction',
  'deviation',
  'deviations',
  'action',
  'verification',
  'refusal',
  'equipment',
  'calibration',
  'weighing',
  'weighings',
  'key',
]);

/**
 * The fields of a detail as "key: value", without the record numbers the server keeps to tie
 * entries together (a reading's, a deviation's): they mean nothing to a reader.
 */
export function genericText(detail: Record<string, unknown>): string {
  return Object.entries(detail)
    .filter(([key, value]) => !RECORD_NUMBERS.has(key) && present(value))
    .map(([key, value]) => `${key}: ${wordsOf(value)}`)
    .join(', ');
}

// Revisions are SHA-256 hex digests; eight characters tell them apart in a log, as git does.
function shortRevision(revision: unknown): string {
  const text = wordsOf(revision);
  return /^[0-9a-f]{9,}$/.test(text) ? text.slice(0, 8) : text || '?';
}
