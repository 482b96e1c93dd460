import { composeMessage, standardFooter, type MessageContent } from '../mail/mail-message.ts';
import { shortMomentWords } from '../../shared/presentation/date-words.ts';
import { kitchenTimeZone } from './kitchen-clock.ts';
import { subjectAt, type MessageSite } from '../mail/message-site.ts';
import type { ProcessAlert } from './process-alerts.ts';

/** Everything an alert's words depend on. */
export interface ProcessAlertFacts {
  readonly alert: ProcessAlert;
  /** ISO time it is sent. */
  readonly now: string;
  readonly recipientName: string;
  /** The batch's page, or the console's for equipment. */
  readonly url: string;
  readonly consoleUrl: string;
  readonly kitchen: string;
  /** The site it is about, named in the subject when the install has several. */
  readonly site?: MessageSite;
}

function subjectOf({ alert }: ProcessAlertFacts): string {
  const what = alert.batchId === null ? alert.subject : `lot ${alert.subject} (${alert.title})`;
  switch (alert.kind) {
    case 'reading-due':
      return `Reading overdue: ${what}`;
    case 'stage-deadline':
      return `Cooling deadline soon: ${what}`;
    case 'deviation':
      return `Deviation: ${what} is on hold`;
  }
}

/** A moment of an alert: with its day always, as an e-mail is read later than it is sent. */
function when(iso: string): string {
  return shortMomentWords(iso, kitchenTimeZone());
}

function paragraphsOf({ alert }: ProcessAlertFacts): string[] {
  const lot = alert.batchId === null ? alert.subject : `Lot ${alert.subject}, ${alert.title}`;
  switch (alert.kind) {
    case 'reading-due':
      return [
        `${lot}: ${alert.what}.`,
        'Take the reading now and record it. A control not monitored as the plan says is itself a gap in the HACCP record.',
      ];
    case 'stage-deadline':
      return [
        `${lot}: ${alert.what}. The deadline is ${when(alert.at)}.`,
        'Check the product temperature now; if it will not make it, move it to a colder place (blast chiller, ice bath) before the deadline passes.',
      ];
    case 'deviation':
      return [
        `${lot}: a critical limit was missed at ${when(alert.at)}. ${alert.what}`,
        'The product is on hold. Record the corrective action: the cause, how control was restored, what prevents it happening again, and what happened to the product.',
      ];
  }
}

/** Why a person gets a process alert, as its footer says. */
export const PROCESS_ALERT_REASON =
  'You get it because your choices include process alerts (readings due, cooling deadlines, deviations).';

/** A process alert's words, plain text and HTML. */
export function processAlertMessage(facts: ProcessAlertFacts): MessageContent {
  return composeMessage({
    subject: subjectAt(subjectOf(facts), facts.site),
    greeting: `Hello ${facts.recipientName},`,
    paragraphs: paragraphsOf(facts),
    action: {
      label: facts.alert.batchId === null ? 'Open Larderbook' : 'Open the batch',
      url: facts.url,
    },
    footer: standardFooter(facts.kitchen, facts.consoleUrl, PROCESS_ALERT_REASON),
  });
}
