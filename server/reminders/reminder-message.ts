import {
  composeMessage,
  dayText,
  standardFooter,
  type MessageContent,
} from '../mail/mail-message.ts';
import type { HoldDates, ReminderKind } from './reminder-schedule.ts';
import { subjectAt, type MessageSite } from '../mail/message-site.ts';

/** The batch a reminder is about. */
export interface RemindedBatch extends HoldDates {
  readonly lotCode: string;
  readonly title: string;
  readonly status: 'curing' | 'proofing';
}

/** Everything a reminder's words depend on. */
export interface ReminderFacts {
  readonly kind: ReminderKind;
  readonly batch: RemindedBatch;
  /** ISO date the reminder is for. */
  readonly dueOn: string;
  /** ISO date it is sent. */
  readonly today: string;
  readonly recipientName: string;
  readonly batchUrl: string;
  readonly consoleUrl: string;
  readonly kitchen: string;
  /** The site it is about, named in the subject when the install has several. */
  readonly site?: MessageSite;
}

const KIND_WORDS: Readonly<Record<ReminderKind, string>> = {
  flip: 'turn-day',
  ready: 'ready-day',
  overdue: 'overdue',
};

function subjectOf(facts: ReminderFacts, late: boolean): string {
  const { batch, dueOn } = facts;
  const what = `lot ${batch.lotCode} (${batch.title})`;
  switch (facts.kind) {
    case 'flip':
      return late ? `Turn was due ${dayText(dueOn)}: ${what}` : `Turn today: ${what}`;
    case 'ready':
      return late ? `Ready since ${dayText(dueOn)}: ${what}` : `Ready today: ${what}`;
    case 'overdue':
      return `Overdue: ${what} is still ${batch.status}, ready ${dayText(batch.ready)}`;
  }
}

function paragraphsOf(facts: ReminderFacts, late: boolean): string[] {
  const { batch, dueOn } = facts;
  const lot = `Lot ${batch.lotCode}, ${batch.title},`;
  const lateness = late
    ? [
        `This reminder was due on ${dayText(dueOn)}; Larderbook was not running then, so it comes late.`,
      ]
    : [];
  switch (facts.kind) {
    case 'flip':
      return [
        `${lot} is due to be turned on ${dayText(dueOn)}: the formula says every ${batch.flipEveryDays ?? '?'} days.`,
        ...lateness,
        `It started on ${dayText(batch.start)} and is ready on ${dayText(batch.ready)}.`,
      ];
    case 'ready':
      return [
        `${lot} reaches the end of its hold on ${dayText(dueOn)} (it started on ${dayText(batch.start)}).`,
        ...lateness,
        `Check it as the formula and your HACCP plan say, then move it on in the batch log: done, or discarded with the reason. Until then it shows as ${batch.status}.`,
      ];
    case 'overdue':
      return [
        `${lot} was ready on ${dayText(batch.ready)} and is still marked ${batch.status} in the batch log.`,
        `If it is finished, mark it done; if it was thrown away, discard it with the reason. If it is held longer on purpose, check that against your HACCP plan.`,
      ];
  }
}

/** A turn, ready or overdue reminder's words, plain text and HTML. */
export function reminderMessage(facts: ReminderFacts): MessageContent {
  const late = facts.kind !== 'overdue' && facts.dueOn < facts.today;
  return composeMessage({
    subject: subjectAt(subjectOf(facts, late), facts.site),
    greeting: `Hello ${facts.recipientName},`,
    paragraphs: paragraphsOf(facts, late),
    action: { label: 'Open the batch', url: facts.batchUrl },
    footer: standardFooter(
      facts.kitchen,
      facts.consoleUrl,
      `You get it because your reminder choices include ${KIND_WORDS[facts.kind]} reminders.`,
    ),
  });
}
