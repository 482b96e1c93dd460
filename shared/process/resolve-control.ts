/**
 * A formula's control with its rule looked up and its units made canonical.
 */
import { parseDuration } from '../units/duration.ts';
import { controlTemplate } from './control-templates.ts';
import type {
  ControlLimit,
  CoolingStage,
  FormulaControl,
  ResolvedControl,
} from './control-types.ts';
import { canonicalUnit, parseLimitValue } from './reading-value.ts';

/** The corrective action of a kitchen's own limit when the formula writes none. */
export const OWN_LIMIT_ACTION =
  'Stop and bring the process back within its limit. Hold the batch for review by the person ' +
  'in charge.';

/**
 * The kitchen's own limit as a ControlLimit.
 * @throws Error or QuantityError when the limit is not one of the forms a formula may write
 */
export function ownLimit(control: FormulaControl): ControlLimit {
  const limit = control.limit;
  if (!limit) throw new Error(`control "${control.id}" has neither a rule nor a limit`);
  const value = (text: string): string => parseLimitValue(text, control.measure).toString();
  if (limit.stages !== undefined) {
    if (limit.stages.length === 0) throw new Error('a cooling limit needs at least one stage');
    const stages: CoolingStage[] = limit.stages.map((stage) => ({
      fromC: value(stage.from),
      toC: value(stage.to),
      withinS: parseDuration(stage.within).toString(),
      countedFrom: stage.counted_from === 'start' ? 'cooling-start' : 'stage-start',
    }));
    return { type: 'cooling', stages };
  }
  if (limit.hold !== undefined) {
    if (limit.min === undefined) throw new Error('a hold needs the temperature it holds at (min)');
    return {
      type: 'hold',
      rows: [{ tempC: value(limit.min), holdS: parseDuration(limit.hold).toString() }],
    };
  }
  if (limit.min !== undefined && limit.max !== undefined) {
    return { type: 'between', min: value(limit.min), max: value(limit.max) };
  }
  if (limit.max !== undefined) return { type: 'at-most', max: value(limit.max) };
  if (limit.min !== undefined) return { type: 'at-least', min: value(limit.min) };
  throw new Error('a limit needs max, min, min with hold, or stages');
}

/**
 * The control as the records use it; the formula was checked, so its rule and limit are good.
 * @throws Error when the rule is unknown or the limit cannot be read (an unchecked formula)
 */
export function resolveControl(control: FormulaControl): ResolvedControl {
  const everyS = control.every === undefined ? null : parseDuration(control.every).toString();
  const base = {
    id: control.id,
    title: control.title,
    step: control.step,
    measure: control.measure,
    unit: canonicalUnit(control.measure),
    everyS,
  };
  if (control.rule !== undefined) {
    const template = controlTemplate(control.rule);
    if (!template) throw new Error(`"${control.rule}" is not a process control rule`);
    return {
      ...base,
      limit: template.limit,
      rule: template.key,
      source: template.source,
      ifMissed: control.if_missed ?? template.defaultAction,
      ...(template.minNitritePpm === undefined ? {} : { minNitritePpm: template.minNitritePpm }),
    };
  }
  return {
    ...base,
    limit: ownLimit(control),
    rule: null,
    source: control.source ?? '',
    ifMissed: control.if_missed ?? OWN_LIMIT_ACTION,
  };
}
