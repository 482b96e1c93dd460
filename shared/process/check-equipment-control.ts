/**
 * Checking a piece of equipment's control: the same checks a formula's control gets, and what
 * equipment needs beyond them. Pure.
 */
import type { EquipmentControl, EquipmentKind } from '../api/equipment.ts';
import {
  equipmentControlProblems,
  equipmentFormulaControl,
  readingLimitWords,
} from './equipment-control.ts';
import { QuantityError } from '../units/quantity-error.ts';
import { resolveControl } from './resolve-control.ts';

/**
 * Every problem with a piece of equipment's control, in words; none when it can be used. Its
 * limit must be judged reading by reading (a maximum, a minimum or both), in °C or °F.
 */
export function checkEquipmentControl(
  name: string,
  kind: EquipmentKind,
  control: EquipmentControl,
): string[] {
  const own = equipmentControlProblems(kind, control);
  if (own.length > 0) return own;
  const formulaControl = equipmentFormulaControl(name, kind, control);
  let resolved;
  try {
    resolved = resolveControl(formulaControl);
  } catch (error) {
    return [error instanceof QuantityError ? error.message : String((error as Error).message)];
  }
  if (readingLimitWords(resolved) === null)
    return [
      'equipment is judged reading by reading: give a temperature limit with a maximum, a minimum or both',
    ];
  return [];
}
