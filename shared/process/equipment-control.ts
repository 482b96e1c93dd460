/**
 * A piece of equipment's control in the formula's control syntax: what the equipment log judges
 * its readings by. Pure.
 */
import type { EquipmentControl, EquipmentKind } from '../api/equipment.ts';
import { controlTemplate } from './control-templates.ts';
import type { FormulaControl, ResolvedControl } from './control-types.ts';
import { temperatureWords } from './control-words.ts';
import { ICE_POINT_TOLERANCE } from './ice-point.ts';

/** What the step is called on a piece of equipment's control, by kind. */
const STEP_OF: Readonly<Record<EquipmentKind, string>> = {
  cooler: 'cold holding',
  freezer: 'frozen storage',
  smoker: 'smoking',
  'hot-holding': 'hot holding',
  thermometer: 'thermometer check',
};

/** What a thermometer's ice-point check is held to, as a control's own limit. */
const ICE_POINT_SOURCE = 'Ice-point check of a thermometer: common practice, no source';

/**
 * The whole formula control a piece of equipment is judged by: its stored control with the
 * equipment's name as title and, when the control gives no measure, its template's or else the
 * air in the unit (chamber temperature). A thermometer's control is only how often it is checked: its limit is
 * the ice-point check (0 °C ± 1 °C), so the same checks and the same `every` apply.
 */
export function equipmentFormulaControl(
  name: string,
  kind: EquipmentKind,
  control: EquipmentControl,
): FormulaControl {
  const base = { id: 'log', title: name, step: STEP_OF[kind], every: control.every };
  if (kind === 'thermometer') {
    const tolerance = ICE_POINT_TOLERANCE.C.toString();
    return {
      ...base,
      measure: 'internal-temperature',
      limit: { min: `-${tolerance} °C`, max: `${tolerance} °C` },
      source: ICE_POINT_SOURCE,
    };
  }
  return {
    ...base,
    measure:
      control.measure ??
      (control.rule === undefined ? undefined : controlTemplate(control.rule)?.measure) ??
      'chamber-temperature',
    ...(control.rule === undefined ? {} : { rule: control.rule }),
    ...(control.limit === undefined ? {} : { limit: control.limit }),
    ...(control.source === undefined ? {} : { source: control.source }),
    ...(control.if_missed === undefined ? {} : { if_missed: control.if_missed }),
  };
}

/**
 * What is wrong with a thermometer's control, in words: it says only how often the thermometer is
 * checked, since its limit is the ice-point check. Other equipment's controls get the formula
 * checks (check-equipment-control.ts).
 */
export function equipmentControlProblems(kind: EquipmentKind, control: EquipmentControl): string[] {
  if (kind !== 'thermometer') return [];
  const extra = Object.keys(control).filter((key) => key !== 'every');
  return extra.length === 0
    ? []
    : [
        `a thermometer is held to the ice-point check; its control says only how often it is checked (every), not ${extra.join(', ')}`,
      ];
}

/**
 * The limit a piece of equipment's readings are judged by, in words: "at or below 5 °C (41 °F)";
 * null for a limit that is not judged reading by reading (a cook or a cool), which equipment
 * cannot have.
 */
export function readingLimitWords(control: ResolvedControl): string | null {
  const { limit } = control;
  if (control.unit !== '°C') return null;
  switch (limit.type) {
    case 'at-most':
      return `at or below ${temperatureWords(limit.max)}`;
    case 'at-least':
      return `at or above ${temperatureWords(limit.min)}`;
    case 'between':
      return `between ${temperatureWords(limit.min)} and ${temperatureWords(limit.max)}`;
    default:
      return null;
  }
}
