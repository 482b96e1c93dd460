import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { Decimal } from '../decimal.ts';
import { fahrenheitToCelsius } from '../units/temperature.ts';
import { LoggerCsvError, parseLoggerCsv } from './logger-csv.ts';

function refusedAt(text: string, line: number, reason: RegExp): void {
  assert.throws(
    () => parseLoggerCsv(text, 'America/Chicago'),
    (error: unknown) =>
      error instanceof LoggerCsvError && error.line === line && reason.test(error.message),
  );
}

describe('reading a logger CSV', () => {
  it('reads a header in °F and local times in the kitchen’s zone', () => {
    const csv = 'Time,Temp (°F)\n2026-03-02 08:00,130\n2026-03-02 09:24:00,80\n';
    const points = parseLoggerCsv(csv, 'America/Chicago');
    // Chicago keeps CST (UTC−6) until the second Sunday of March (8 March 2026)
    assert.deepEqual(
      points.map((point) => point.at),
      ['2026-03-02T14:00:00.000Z', '2026-03-02T15:24:00.000Z'],
    );
    // source: 130 °F → (130 − 32) × 5/9 °C, the Appendix B figure and arithmetic
    assert.equal(points[0].value, fahrenheitToCelsius(new Decimal(130)).toString());
    assert.equal(points[0].enteredAs, '130 °F');
  });

  it('reads a header that says Celsius, semicolons, decimal commas and day-first dates', () => {
    const csv =
      'Nr;Datum/Zeit;Temperatur Celsius\n1;02.03.2026 14:05;71,5\n2;02.03.2026 14:06;72,0\n';
    const points = parseLoggerCsv(csv, 'Europe/Berlin');
    assert.deepEqual(points[0], {
      at: '2026-03-02T13:05:00.000Z',
      value: '71.5',
      enteredAs: '71.5 °C',
    });
  });

  it('reads a file with no header, an index column, US dates with AM/PM and a unit on each value', () => {
    const csv = '1,03/02/2026 11:59:30 PM,41 °F\n\n2,03/03/2026 12:00:30 AM,5.2C\n';
    const points = parseLoggerCsv(csv, 'UTC');
    assert.deepEqual(
      points.map((point) => [point.at, point.value]),
      [
        ['2026-03-02T23:59:30.000Z', '5'],
        ['2026-03-03T00:00:30.000Z', '5.2'],
      ],
    );
  });

  it('keeps an ISO zone written in the file over the kitchen’s', () => {
    const points = parseLoggerCsv('2026-03-02T14:00:00+01:00,70 °C\n', 'America/Chicago');
    assert.equal(points[0].at, '2026-03-02T13:00:00.000Z');
  });

  it('returns the points oldest first', () => {
    const csv = 'time,temp °C\n2026-03-02T10:00Z,60\n2026-03-02T09:00Z,70\n';
    assert.deepEqual(
      parseLoggerCsv(csv, 'UTC').map((point) => point.value),
      ['70', '60'],
    );
  });

  it('reads a time twice over when the clocks go back, in the file’s order', () => {
    // 1 November 2026: Chicago goes from CDT (UTC−5) back to CST (UTC−6) at 02:00
    const csv = 'Time,Temp (°C)\n2026-11-01 01:30,4\n2026-11-01 01:59,4.2\n2026-11-01 01:15,4.5\n';
    assert.deepEqual(
      parseLoggerCsv(csv, 'America/Chicago').map((point) => point.at),
      ['2026-11-01T06:30:00.000Z', '2026-11-01T06:59:00.000Z', '2026-11-01T07:15:00.000Z'],
    );
  });

  it('refuses a bad line by its number and says why', () => {
    refusedAt('Time,Temp (°C)\n2026-03-02 08:00,70\n\n2026-03-02 08:30,hot\n', 4, /"hot"/);
    refusedAt('Time,Temp (°C)\n2026-13-02 08:00,70\n', 2, /no month 13/);
    refusedAt('Time,Temp (°C)\nyesterday,70\n', 2, /not a date and time/);
    refusedAt('2026-03-02 08:00,70,4,9\n', 1, /two columns/);
    refusedAt('2026-03-02 08:00,70 °C\n2026-03-02 08:30\n', 2, /expected 2 columns/);
  });

  it('refuses a value with no °C or °F anywhere', () => {
    refusedAt('Time,Temperature\n2026-03-02 08:00,70\n', 2, /°C or °F/);
  });

  it('refuses a time the clocks skip', () => {
    // 8 March 2026: Chicago goes from 02:00 CST straight to 03:00 CDT
    refusedAt('Time,Temp (°C)\n2026-03-08 02:30,4\n', 2, /does not exist/);
  });

  it('refuses a file with no points', () => {
    refusedAt('', 1, /no readings/);
    refusedAt('Time,Temp (°C)\n\n', 3, /no readings/);
  });
});
