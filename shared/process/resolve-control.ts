/**
 * A formula's control with its rule looked up and its units made canonical. CONTRACT STUB: the
 * core engineer replaces the body.
 */
import type { FormulaControl, ResolvedControl } from './control-types.ts';

/** The control as the records use it; the formula was checked, so its rule and limit are good. */
export function resolveControl(control: FormulaControl): ResolvedControl {
  void control;
  throw new Error('resolveControl is not built yet');
}
