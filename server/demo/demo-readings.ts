import { Decimal } from '../../shared/decimal.ts';
import type { ResolvedControl } from '../../shared/process/control-types.ts';

/** One demo reading: when, and the value as a cook would type it. */
export interface DemoPoint {
  readonly at: string;
  readonly value: string;
}

const MINUTE = 60_000;

/** A time `minutes` after an ISO time. */
export function after(iso: string, minutes: number): string {
  return new Date(Date.parse(iso) + minutes * MINUTE).toISOString();
}

/** °C to one decimal as typed. */
function celsius(value: Decimal): string {
  return `${value.toDecimalPlaces(1).toFixed(1)} °C`;
}

/** Minutes between readings of a control: its own frequency, else every half hour. */
function everyMinutes(control: ResolvedControl): number {
  return control.everyS === null ? 30 : Math.max(5, Number(control.everyS) / 60);
}

/**
 * Readings of a temperature control that keep to its limit, from `start` for `minutes`: a chamber
 * steady inside its band, a cook held above its temperature for its time, a cool that reaches each
 * stage well in time. Deterministic: the same control and times give the same readings. `over`
 * puts one reading of an at-most or between limit 2.5 °C over its maximum (the demo's deviation).
 * Measures other than temperatures get none.
 */
export function demoReadings(
  control: ResolvedControl,
  start: string,
  minutes: number,
  { over }: { over?: number } = {},
): DemoPoint[] {
  if (control.unit !== '°C') return [];
  const limit = control.limit;
  const step = everyMinutes(control);
  // A single check (no frequency) is one reading.
  const count = control.everyS === null ? 1 : Math.floor(minutes / step) + 1;
  const times = Array.from({ length: count }, (_, i) => i * step);
  switch (limit.type) {
    case 'at-most':
    case 'between': {
      const max = new Decimal(limit.max);
      const steady =
        limit.type === 'between' ? max.plus(limit.min).div(2) : max.minus(new Decimal(2));
      return times.map((m, i) => ({
        at: after(start, m),
        value: celsius(i === over ? max.plus('2.5') : steady.plus(((i % 3) - 1) * 0.5)),
      }));
    }
    case 'at-least':
      return times.map((m, i) => ({
        at: after(start, m),
        value: celsius(new Decimal(limit.min).plus(2 + (i % 2) * 0.5)),
      }));
    case 'hold': {
      // The row held for the shortest time (an instant one where the table has it), held past it.
      const row = [...limit.rows].sort((a, b) => Number(a.holdS) - Number(b.holdS))[0];
      const held = Math.ceil(Number(row.holdS) / 60) + 2;
      const hot = new Decimal(row.tempC).plus('1.5');
      return [
        { at: after(start, 0), value: celsius(hot.minus(8)) },
        { at: after(start, 20), value: celsius(hot) },
        { at: after(start, 20 + held), value: celsius(hot.plus('0.5')) },
      ];
    }
    case 'cooling':
      return coolingReadings(limit.stages, start, minutes);
  }
}

/**
 * A cool from just above the first stage's start, each stage reached at 60 % of its time: readings
 * every 20 minutes along straight lines, stopped at `minutes` (a cool still under way).
 */
function coolingReadings(
  stages: Extract<ResolvedControl['limit'], { type: 'cooling' }>['stages'],
  start: string,
  minutes: number,
): DemoPoint[] {
  const points: { m: number; c: Decimal }[] = [{ m: 0, c: new Decimal(stages[0].fromC).plus(2) }];
  let at = 0;
  for (const stage of stages) {
    at += Math.round((Number(stage.withinS) / 60) * 0.6);
    points.push({ m: at, c: new Decimal(stage.toC).minus(1) });
  }
  const readings: DemoPoint[] = [];
  for (let m = 0; m <= Math.min(minutes, at); m += 20) {
    const i = points.findIndex((p) => p.m >= m);
    const [a, b] = i <= 0 ? [points[0], points[0]] : [points[i - 1], points[i]];
    const share = b.m === a.m ? new Decimal(0) : new Decimal(m - a.m).div(b.m - a.m);
    readings.push({ at: after(start, m), value: celsius(a.c.plus(b.c.minus(a.c).times(share))) });
  }
  if (minutes >= at && readings[readings.length - 1]?.at !== after(start, at))
    readings.push({ at: after(start, at), value: celsius(points[points.length - 1].c) });
  return readings;
}
