import type { Transaction } from 'sequelize';
import type { Equipment } from '../../shared/api/equipment.ts';
import { Decimal } from '../../shared/decimal.ts';
import type { ResolvedControl } from '../../shared/process/control-types.ts';
import {
  equipmentFormulaControl,
  readingLimitWords,
} from '../../shared/process/equipment-control.ts';
import { evaluateControl } from '../../shared/process/evaluate-control.ts';
import { resolveControl } from '../../shared/process/resolve-control.ts';
import { kitchenClock } from '../process/kitchen-clock.ts';
import type { EquipmentRow, EquipmentRows } from './equipment-rows.ts';

/** The control a piece of equipment is judged by, resolved (its limit canonical, every in s). */
export function resolvedOf(row: Pick<EquipmentRow, 'name' | 'kind' | 'control'>): ResolvedControl {
  return resolveControl(equipmentFormulaControl(row.name, row.kind, row.control));
}

/** ISO time `seconds` after an ISO time. */
export function after(iso: string, seconds: string | null): string | null {
  if (seconds === null) return null;
  return new Date(
    Date.parse(iso) + new Decimal(seconds).times(1000).round().toNumber(),
  ).toISOString();
}

const DAY_S = 86_400;

/** The limit and how often, in words, with the source. */
function limitWordsOf(row: EquipmentRow, control: ResolvedControl): string {
  const every = row.control.every;
  if (row.kind === 'thermometer') {
    const days = control.everyS === null ? null : new Decimal(control.everyS).div(DAY_S);
    const often = days?.isInteger() ? `${days.toString()} ${days.eq(1) ? 'day' : 'days'}` : every;
    return `Ice-point check every ${often}: within 1 °C (2 °F) of 0 °C (32 °F) in ice water`;
  }
  const limit = readingLimitWords(control) ?? control.rule ?? 'its limit';
  return `${limit}, every ${every} · ${control.source}`;
}

/**
 * A piece of equipment as the API shows it at `now`: its latest reading judged by the limit now
 * in force (evaluateControl over that one reading: equipment limits are judged reading by
 * reading, so an old miss, already a deviation, does not colour the unit for ever), and when the
 * next reading or ice-point check is due: the last one plus `every`, or at once before the first.
 */
export async function viewOf(
  rows: EquipmentRows,
  row: EquipmentRow,
  now: Date,
  transaction?: Transaction,
): Promise<Equipment> {
  const control = resolvedOf(row);
  const thermometer = row.kind === 'thermometer';
  const lastReading = thermometer ? null : await rows.lastReading(row.id, transaction);
  const lastCalibration = thermometer ? await rows.lastCalibration(row.id, transaction) : null;
  const state = thermometer
    ? null
    : evaluateControl(
        control,
        lastReading ? [{ at: lastReading.at, value: lastReading.value }] : [],
        kitchenClock(now),
      );
  const last = lastReading?.at ?? lastCalibration?.at;
  const nextDue = !row.active
    ? null
    : last === undefined
      ? row.createdAt
      : after(last, control.everyS);
  return {
    ...row,
    limitWords: limitWordsOf(row, control),
    lastReading,
    lastCalibration,
    state,
    nextDue,
    overdue: nextDue !== null && Date.parse(nextDue) <= now.getTime(),
  };
}

/** Active first, the one due soonest first; then retired ones by name. */
export function byNextDue(a: Equipment, b: Equipment): number {
  if (a.active !== b.active) return a.active ? -1 : 1;
  if (a.nextDue && b.nextDue && a.nextDue !== b.nextDue) return a.nextDue < b.nextDue ? -1 : 1;
  return a.name.localeCompare(b.name);
}
