/** Building controls and readings for the judging's specs, in the °F the sources print. */
import { Decimal } from '../decimal.ts';
import { fahrenheitToCelsius } from '../units/temperature.ts';
import type { ReadingPoint, ResolvedControl } from './control-types.ts';
import { resolveControl } from './resolve-control.ts';

/** The start of every log in the specs. */
export const START = '2026-03-02T12:00:00.000Z';

/** A control using a template, monitored every `every`. */
export function templateControl(rule: string, every = '30 min'): ResolvedControl {
  return resolveControl({
    id: 'check',
    title: 'Check',
    step: 'cook',
    measure: 'internal-temperature',
    rule,
    every,
  });
}

/** A reading `hours` after START at `degreesF`. */
export function readingF(hours: string, degreesF: string): ReadingPoint {
  const ms = new Decimal(hours).times(3_600_000).toNumber();
  return {
    at: new Date(Date.parse(START) + ms).toISOString(),
    value: fahrenheitToCelsius(new Decimal(degreesF)).toString(),
  };
}

/** A reading `minutes` after START at `degreesF`. */
export function readingAtMinuteF(minutes: string, degreesF: string): ReadingPoint {
  return readingF(new Decimal(minutes).div(60).toString(), degreesF);
}

/** A clock `hours` after START, in UTC. */
export function clockAt(hours: string): { now: string; timeZone: string } {
  return { now: readingF(hours, '0').at, timeZone: 'UTC' };
}
