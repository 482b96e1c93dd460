/**
 * The ice-point check of a thermometer: a probe in a slurry of crushed ice and water reads the
 * freezing point of water. Pure.
 */
import { Decimal } from '../decimal.ts';
import { readTemperature, type TemperatureScale } from '../units/temperature.ts';

/** Where an ice slurry stands, in each scale. source: the freezing point of water, 0 °C = 32 °F */
const ICE_POINT: Readonly<Record<TemperatureScale, Decimal>> = {
  C: new Decimal(0),
  F: new Decimal(32),
};

/**
 * How far from the ice point a thermometer may read and still pass, in the scale it reads in.
 * common practice, no source: ±1 °C, ±2 °F (the two are not the same width; each scale's own
 * figure is the trade's rule for a thermometer showing that scale)
 */
export const ICE_POINT_TOLERANCE: Readonly<Record<TemperatureScale, Decimal>> = {
  C: new Decimal(1),
  F: new Decimal(2),
};

/** What an ice-point reading says. */
export interface IcePointResult {
  /** The reading in °C. */
  readonly celsius: Decimal;
  /** Whether it is within the tolerance of the ice point in the scale it was read in. */
  readonly passes: boolean;
  /** Words for a cook: "reads 1.5 °C in ice water: 1.5 °C off 0 °C, more than the 1 °C allowed". */
  readonly words: string;
}

/**
 * Judges a thermometer's reading in ice water ("0.5 °C", "33 °F") against the ice point, in the
 * scale it was read in.
 * @throws QuantityError when the text is not a temperature
 */
export function icePointCheck(text: string): IcePointResult {
  const { celsius, value, scale } = readTemperature(text);
  const off = value.minus(ICE_POINT[scale]).abs();
  const tolerance = ICE_POINT_TOLERANCE[scale];
  const passes = off.lessThanOrEqualTo(tolerance);
  const unit = `°${scale}`;
  const reads = `reads ${value.toString()} ${unit} in ice water`;
  const words = passes
    ? `${reads}: within ${tolerance.toString()} ${unit} of ${ICE_POINT[scale].toString()} ${unit}`
    : `${reads}: ${off.toString()} ${unit} off ${ICE_POINT[scale].toString()} ${unit}, more than the ${tolerance.toString()} ${unit} allowed`;
  return { celsius, passes, words };
}
