/** The three reminders: turn the meat, it is ready, it is past ready and still held. */
export type ReminderKind = 'flip' | 'ready' | 'overdue';

/** Which reminders a person gets. */
export type ReminderChoices = Readonly<Record<ReminderKind, boolean>>;

/** GET and PUT /api/people/me/reminders: the signed-in person's own choices. */
export interface ReminderSettings {
  /** Where reminders go; null when the person has no address, so nothing can be sent. */
  readonly email: string | null;
  readonly choices: ReminderChoices;
  /** Whether the person chose (false: their role's defaults apply). */
  readonly chosen: boolean;
  /** What their role gets until they choose. */
  readonly defaults: ReminderChoices;
  /** Whether they get process alerts: a reading overdue, a cooling deadline near, a limit missed. */
  readonly processAlerts: boolean;
  /** Whether their role gets process alerts until they choose. */
  readonly processAlertsDefault: boolean;
}

/** The choices a person saves: the reminders and whether they get process alerts. */
export type MyChoices = ReminderChoices & { readonly processAlerts: boolean };

/** A reminder as the dialog offers it: its name and when it comes, in our words. */
export interface ReminderOption {
  readonly kind: ReminderKind;
  readonly label: string;
  readonly description: string;
}

/** The three reminders, in the order a cure meets them. */
export const REMINDER_OPTIONS: readonly ReminderOption[] = [
  {
    kind: 'flip',
    label: 'Turn days',
    description: 'A batch in cure is due to be turned today.',
  },
  {
    kind: 'ready',
    label: 'Ready days',
    description: 'A batch has reached the end of its hold and is ready today.',
  },
  {
    kind: 'overdue',
    label: 'Overdue batches',
    description: 'A batch is still held the day after it was ready.',
  },
];

/**
 * Whether two sets of choices are the same.
 * @param a One set of choices.
 * @param b The other.
 */
export function sameChoices(a: ReminderChoices, b: ReminderChoices): boolean {
  return REMINDER_OPTIONS.every(({ kind }) => a[kind] === b[kind]);
}

/**
 * The choices in one sentence: "You get turn-day and ready-day reminders.", "You get no reminders."
 * @param choices Which reminders are on.
 */
export function choicesText(choices: ReminderChoices): string {
  const words: Readonly<Record<ReminderKind, string>> = {
    flip: 'turn-day',
    ready: 'ready-day',
    overdue: 'overdue',
  };
  const on = REMINDER_OPTIONS.filter(({ kind }) => choices[kind]).map(({ kind }) => words[kind]);
  if (on.length === 0) return 'You get no reminders.';
  const list = on.length === 1 ? on[0] : `${on.slice(0, -1).join(', ')} and ${on[on.length - 1]}`;
  return `You get ${list} reminders.`;
}
