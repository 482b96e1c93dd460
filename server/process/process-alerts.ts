import type { BatchControl } from '../../shared/api/process-record.ts';
import { kitchenTime } from './kitchen-clock.ts';

/** The three process alerts: a reading overdue, a cooling stage near its deadline, a deviation. */
export type ProcessAlertKind = 'reading-due' | 'stage-deadline' | 'deviation';

/** How long a reading may be late before it is chased: a cook finishing a task. common practice, no source */
export const READING_GRACE_MS = 10 * 60_000;
/** How long before a cooling stage's deadline the cooks are warned, as the plan asks. */
export const STAGE_WARNING_MS = 30 * 60_000;

/** An alert to send once, named by its dedupe key. */
export interface ProcessAlert {
  readonly kind: ProcessAlertKind;
  /** Names the alert exactly, e.g. "stage-deadline batch 12/chill/stage-1/2026-…Z": sent once. */
  readonly key: string;
  readonly batchId: number | null;
  readonly equipmentId: number | null;
  /** The lot code, or the equipment's name. */
  readonly subject: string;
  /** The formula's title, or the equipment's kind. */
  readonly title: string;
  /** Words for a cook: "Chilling after the smoke: reading overdue since 14:30". */
  readonly what: string;
  /** ISO time it is about: the reading due, the stage's deadline, the deviation opened. */
  readonly at: string;
}

/** The batch an alert is about. */
export interface AlertedBatch {
  readonly id: number;
  readonly lotCode: string;
  readonly formulaTitle: string;
}

/**
 * The reading and stage alerts a batch being made is owed at `now`, from its judged controls:
 * - reading-due: a control's next reading is more than {@link READING_GRACE_MS} late, once per
 *   due time (a reading taken moves the due time on; a new lateness is a new alert);
 * - stage-deadline: a cooling stage not reached with its deadline {@link STAGE_WARNING_MS} or less
 *   away, once per stage and deadline. A deadline already passed is a deviation, alerted as one.
 */
export function batchAlerts(
  batch: AlertedBatch,
  judged: readonly BatchControl[],
  now: string,
): ProcessAlert[] {
  const nowMs = Date.parse(now);
  const alerts: ProcessAlert[] = [];
  const base = {
    batchId: batch.id,
    equipmentId: null,
    subject: batch.lotCode,
    title: batch.formulaTitle,
  };
  for (const { control, state } of judged) {
    const { nextDue, stage } = state;
    if (nextDue && Date.parse(nextDue) + READING_GRACE_MS <= nowMs)
      alerts.push({
        ...base,
        kind: 'reading-due',
        key: `reading-due batch ${batch.id}/${control.id}/${nextDue}`,
        what: `${control.title}: reading overdue since ${kitchenTime(nextDue, now)}`,
        at: nextDue,
      });
    if (stage) {
      const deadline = Date.parse(stage.deadline);
      if (deadline > nowMs && deadline - nowMs <= STAGE_WARNING_MS)
        alerts.push({
          ...base,
          kind: 'stage-deadline',
          key: `stage-deadline batch ${batch.id}/${control.id}/stage-${stage.index}/${stage.deadline}`,
          what: `${control.title}: ${state.summary}`,
          at: stage.deadline,
        });
    }
  }
  return alerts;
}
