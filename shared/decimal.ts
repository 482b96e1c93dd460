import { Decimal as DecimalBase } from 'decimal.js';

/**
 * The project's own decimal constructor: 40 significant digits and half-up rounding, cloned so
 * that no other code changing the global decimal.js settings can alter our arithmetic.
 */
export const Decimal = DecimalBase.clone({
  precision: 40,
  rounding: DecimalBase.ROUND_HALF_UP,
  toExpNeg: -30,
  toExpPos: 40,
});

/** An exact decimal value made by {@link Decimal}. */
export type Decimal = DecimalBase;

/** Anything the decimal constructor accepts: a numeric string, a number or a decimal. */
export type DecimalInput = string | number | DecimalBase;

export const ZERO = new Decimal(0);
export const ONE = new Decimal(1);
export const HUNDRED = new Decimal(100);
export const MILLION = new Decimal(1_000_000);

/** Builds a decimal from a string, number or decimal. */
export function dec(value: DecimalInput): Decimal {
  return new Decimal(value);
}

/** Adds up a list of decimals; an empty list adds up to zero. */
export function sum(values: Iterable<Decimal>): Decimal {
  let total = ZERO;
  for (const value of values) total = total.plus(value);
  return total;
}

/** Turns a percentage (3.5 meaning 3.5 %) into a fraction (0.035). */
export function fraction(percent: Decimal): Decimal {
  return percent.div(HUNDRED);
}

/** Turns a fraction (0.035) into a percentage (3.5). */
export function percentOf(part: Decimal, whole: Decimal): Decimal {
  if (whole.isZero()) throw new RangeError('percentOf: the whole is zero');
  return part.div(whole).times(HUNDRED);
}
