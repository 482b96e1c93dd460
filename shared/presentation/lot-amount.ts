import type { LotMeasure } from '../api/trace-record.ts';
import { Decimal } from '../decimal.ts';
import { formatMass } from './format-figure.ts';

/** Millilitres from which a volume prints in litres, as masses print in kilograms from 10 kg. */
const LITRES_FROM = new Decimal(10_000);

/**
 * An amount of a lot in words, from its exact text in the base measure: "12.500 kg", "850 g",
 * "12.5 l", "24 each". Masses print as the batch sheet prints them.
 */
export function lotAmountWords(amount: string, measure: LotMeasure): string {
  const value = new Decimal(amount);
  if (measure === 'g') return formatMass(value, 'metric');
  if (measure === 'each') return `${value.toDecimalPlaces(2).toString()} each`;
  return value.greaterThanOrEqualTo(LITRES_FROM)
    ? `${value.div(1000).toDecimalPlaces(3).toString()} l`
    : `${value.toDecimalPlaces(0).toString()} ml`;
}
