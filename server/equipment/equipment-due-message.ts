import type { Equipment } from '../../shared/api/equipment.ts';
import { composeMessage, standardFooter, type MessageContent } from '../mail/mail-message.ts';
import { kitchenTimeZone } from '../process/kitchen-clock.ts';
import { shortMomentWords } from '../../shared/presentation/date-words.ts';
import { PROCESS_ALERT_REASON } from '../process/process-alert-message.ts';
import { subjectAt, type MessageSite } from '../mail/message-site.ts';

/** Everything an equipment-due reminder's words depend on. */
export interface EquipmentDueFacts {
  readonly equipment: Equipment;
  /** ISO time the reading or check fell due. */
  readonly dueAt: string;
  readonly recipientName: string;
  readonly equipmentUrl: string;
  readonly consoleUrl: string;
  readonly kitchen: string;
  /** The site it is about, named in the subject when the install has several. */
  readonly site?: MessageSite;
}

/** A time as the kitchen reads it, the short form of the console's boards: "Thu 3 Dec, 14:00". */
function timeText(iso: string): string {
  return shortMomentWords(iso, kitchenTimeZone());
}

/** A reading or ice-point check that is overdue, in words, plain text and HTML. */
export function equipmentDueMessage(facts: EquipmentDueFacts): MessageContent {
  const { equipment } = facts;
  const thermometer = equipment.kind === 'thermometer';
  const what = thermometer ? 'ice-point check' : 'reading';
  const last = thermometer ? equipment.lastCalibration?.at : equipment.lastReading?.at;
  return composeMessage({
    subject: subjectAt(
      `Overdue: ${equipment.name} ${what}, due ${timeText(facts.dueAt)}`,
      facts.site,
    ),
    greeting: `Hello ${facts.recipientName},`,
    paragraphs: [
      `The ${what} of ${equipment.name} was due at ${timeText(facts.dueAt)} and none is recorded yet.`,
      last
        ? `The last one was taken at ${timeText(last)}. ${equipment.limitWords}.`
        : `None has been recorded since it was added. ${equipment.limitWords}.`,
      thermometer
        ? 'Check it in ice water and record what it reads; until then, check its readings against another thermometer.'
        : 'Take the reading and record it: out of the limit, it opens a deviation for a corrective action.',
    ],
    action: { label: 'Open the equipment log', url: facts.equipmentUrl },
    footer: standardFooter(facts.kitchen, facts.consoleUrl, PROCESS_ALERT_REASON),
  });
}
