/**
 * Checking a piece of equipment's control: the same checks a formula's control gets, and what
 * equipment needs beyond them. Pure.
 */
import type { EquipmentControl, EquipmentKind } from '../api/equipment.ts';
import type { MixFormula } from '../formula/formula-types.ts';
import { checkControls } from './check-controls.ts';
import {
  equipmentControlProblems,
  equipmentFormulaControl,
  readingLimitWords,
} from './equipment-control.ts';
import { resolveControl } from './resolve-control.ts';

/**
 * Every problem with a piece of equipment's control, in words; none when it can be used. The
 * control is checked as the one control of a formula that holds nothing else (so every check a
 * formula's control gets applies: a known rule that fits the measure, an own limit with its
 * source and units, how often); then its limit must be judged reading by reading (a maximum, a
 * minimum or both).
 */
export function checkEquipmentControl(
  name: string,
  kind: EquipmentKind,
  control: EquipmentControl,
): string[] {
  const own = equipmentControlProblems(kind, control);
  if (own.length > 0) return own;
  const formulaControl = equipmentFormulaControl(name, kind, control);
  const holder: MixFormula = {
    formula: 1,
    id: 'equipment',
    title: name,
    kind: 'mix',
    ingredients: [],
    controls: [formulaControl],
  };
  const errors = checkControls(holder).filter((problem) => problem.severity === 'error');
  if (errors.length > 0) return errors.map((problem) => problem.message);
  if (readingLimitWords(resolveControl(formulaControl)) === null)
    return [
      'equipment is judged reading by reading: give a temperature limit with a maximum, a minimum or both',
    ];
  return [];
}
