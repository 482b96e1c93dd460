import type { Equipment, EquipmentKind } from './equipment-types';

/** How a piece of equipment stands, for its chip: words and a tone the colour follows. */
export interface EquipmentStanding {
  readonly words: string;
  readonly tone: 'ok' | 'bad' | 'due' | 'idle';
  readonly icon: string;
}

/** A kind in a cook's words. */
export const KIND_WORDS: Readonly<Record<EquipmentKind, string>> = {
  cooler: 'Cooler',
  freezer: 'Freezer',
  smoker: 'Smoker',
  'hot-holding': 'Hot-holding unit',
  thermometer: 'Thermometer',
};

/**
 * Where a piece stands: out of its limit before all (a deviation to act on), then overdue, then
 * within its limit; retired and never-read pieces say so.
 */
export function standingOf(equipment: Equipment): EquipmentStanding {
  if (!equipment.active) return { words: 'Retired', tone: 'idle', icon: 'block' };
  if (equipment.kind === 'thermometer') {
    if (!equipment.lastCalibration)
      return { words: 'Never checked', tone: 'due', icon: 'schedule' };
    if (equipment.overdue) return { words: 'Check overdue', tone: 'due', icon: 'schedule' };
    return { words: 'Checked in ice water', tone: 'ok', icon: 'check_circle' };
  }
  const status = equipment.state?.status;
  if (status === 'missed') return { words: 'Out of limit', tone: 'bad', icon: 'error' };
  if (!equipment.lastReading) return { words: 'No reading yet', tone: 'due', icon: 'schedule' };
  if (equipment.overdue) return { words: 'Reading overdue', tone: 'due', icon: 'schedule' };
  return { words: 'Within limit', tone: 'ok', icon: 'check_circle' };
}
