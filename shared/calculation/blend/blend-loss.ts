import { Decimal, HUNDRED, ONE } from '../../decimal.ts';
import type { BlendFormula } from '../../formula/formula-types.ts';
import type { Figure } from '../calc-result.ts';

/**
 * The share of a blend left after grinding and forming: 1 − loss_pct / 100, or 1 without a loss.
 * Portions are cut from what is left, and a plan works back through it: batch = portions ×
 * portion ÷ (1 − loss / 100). The loss itself (typically 1–3 %) is common practice, no source.
 */
export function keptAfterLoss(formula: BlendFormula): Decimal {
  if (formula.loss_pct === undefined) return ONE;
  return ONE.minus(new Decimal(formula.loss_pct).div(HUNDRED));
}

/** The loss allowance as the sheet shows it among the inputs; none when the formula gives none. */
export function lossInput(formula: BlendFormula): Figure | undefined {
  if (formula.loss_pct === undefined) return undefined;
  return {
    label: 'Loss allowance',
    kind: 'percent',
    value: new Decimal(formula.loss_pct),
    note: 'from the formula: lost in grinding and forming, before portions are cut',
  };
}
