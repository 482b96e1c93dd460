import type { Transaction } from 'sequelize';
import { flipDays } from '../../shared/calculation/turn-days.ts';
import type { PresentedResult } from '../../shared/presentation/presented-result.ts';
import type { AppContext } from '../app-context.ts';
import type { BatchActor } from '../batches/batch.ts';
import { insertTurn } from '../batches/batch-turns.ts';

const NOTES = [
  'Rubbed the cure that ran off back into the meat.',
  'Restacked, bottom pieces to the top.',
  null,
];

/**
 * The turns of a demo cure still curing: each turning day before the latest one done on its day
 * in the morning, so the board shows the states a kitchen sees — the latest turning day missed
 * when it was yesterday or before ("Turn due since"); when it is today, every other cure turned
 * already ("Turned today") and the rest still to turn.
 */
export async function seedTurns(
  context: AppContext,
  transaction: Transaction,
  cure: {
    readonly lot: string;
    readonly result: PresentedResult;
    readonly index: number;
    readonly today: string;
    readonly now: Date;
    readonly by: BatchActor;
  },
): Promise<void> {
  const schedule = cure.result.schedule;
  if (!schedule?.start || !schedule.ready || !schedule.flipEveryDays) return;
  const days = flipDays({
    start: schedule.start,
    ready: schedule.ready,
    flipEveryDays: schedule.flipEveryDays,
  }).filter((day) => day <= cure.today);
  const latest = days.at(-1);
  const turned = latest === cure.today && cure.index % 2 === 0 ? days : days.slice(0, -1);
  for (const [i, day] of turned.entries()) {
    const at =
      day === cure.today
        ? new Date(cure.now.getTime() - 40 * 60_000).toISOString()
        : `${day}T0${8 + (i % 2)}:${String(10 + ((cure.index * 7) % 40)).padStart(2, '0')}:00.000Z`;
    await insertTurn(context.db, transaction, {
      lot: cure.lot,
      day,
      at,
      personId: cure.by.id,
      note: NOTES[(cure.index + i) % NOTES.length],
    });
  }
}
