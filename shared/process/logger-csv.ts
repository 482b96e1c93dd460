/**
 * A data-logging thermometer's CSV export read into readings: time and temperature, with or
 * without a header line, comma or semicolon, °C or °F from the header or the value, an index
 * column tolerated. Any line it cannot read refuses the whole file, naming the line.
 */
import type { Decimal } from '../decimal.ts';
import { QuantityError } from '../units/quantity-error.ts';
import { parseTemperature } from '../units/temperature.ts';
import { DateTimeError, readLoggerDateTime } from './local-time.ts';

/** One row of the log: ISO time and °C as a decimal string, and the value as written. */
export interface LoggedPoint {
  readonly at: string;
  readonly value: string;
  readonly enteredAs: string;
}

/** A line of the file that cannot be read, with its 1-based number and why. */
export class LoggerCsvError extends Error {
  constructor(
    readonly line: number,
    message: string,
  ) {
    super(`line ${line}: ${message}`);
    this.name = 'LoggerCsvError';
  }
}

/** Where the time and temperature are in each row, and the scale the header gives. */
interface Layout {
  readonly date: number | null;
  readonly time: number;
  readonly temperature: number;
  readonly scale: 'C' | 'F' | null;
  readonly width: number | null;
}

/** Splits one line on the delimiter, honouring double quotes. */
function cells(line: string, delimiter: string): string[] {
  const out: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const char = line[i];
    if (char === '"') {
      if (quoted && line[i + 1] === '"') {
        cell += '"';
        i++;
      } else quoted = !quoted;
    } else if (char === delimiter && !quoted) {
      out.push(cell.trim());
      cell = '';
    } else cell += char;
  }
  out.push(cell.trim());
  return out;
}

function scaleOf(text: string): 'C' | 'F' | null {
  if (/°\s*F|\bdeg\s*F\b|fahrenheit|\(\s*F\s*\)|\bF\b/i.test(text)) return 'F';
  if (/°\s*C|\bdeg\s*C\b|celsius|\(\s*C\s*\)|\bC\b/i.test(text)) return 'C';
  return null;
}

/** The layout a header line names, or null when no column reads as a time and a temperature. */
function headerLayout(names: readonly string[]): Layout | null {
  const lower = names.map((name) => name.toLowerCase());
  const temperature = lower.findIndex((name) => /temp|celsius|fahrenheit|°/.test(name));
  const timestamp = lower.findIndex((name) => /date.*time|time.*stamp|timestamp|zeit/.test(name));
  const date = lower.findIndex((name) => /^date$|^datum$/.test(name));
  const time = lower.findIndex((name) => /^time$|^uhrzeit$/.test(name));
  if (temperature === -1) return null;
  const scale = scaleOf(names[temperature]);
  if (timestamp !== -1) return { date: null, time: timestamp, temperature, scale, width: null };
  if (date !== -1 && time !== -1) return { date, time, temperature, scale, width: null };
  const anyTime = lower.findIndex((name) => /date|time/.test(name));
  return anyTime === -1 ? null : { date: null, time: anyTime, temperature, scale, width: null };
}

/** The layout of a file without a header: time,temperature or index,time,temperature. */
function bareLayout(row: readonly string[]): Layout | null {
  if (row.length === 2) return { date: null, time: 0, temperature: 1, scale: null, width: 2 };
  if (row.length === 3 && /^\d+$/.test(row[0])) {
    return { date: null, time: 1, temperature: 2, scale: null, width: 3 };
  }
  return null;
}

function readTemperature(cell: string, layout: Layout, decimalComma: boolean): [Decimal, string] {
  const text = decimalComma ? cell.replace(/(\d),(\d)/, '$1.$2') : cell;
  if (text === '') throw new QuantityError(cell, 'a temperature', 'the temperature is missing');
  if (/^[+-]?(\d+(\.\d*)?|\.\d+)$/.test(text)) {
    if (!layout.scale) {
      throw new QuantityError(
        cell,
        'a temperature',
        'say °C or °F, in the header ("Temp (°C)") or after the value',
      );
    }
    const written = `${text} °${layout.scale}`;
    return [parseTemperature(written), written];
  }
  return [parseTemperature(text), cell];
}

/** What a thrown reading error says, for the line's message. */
function reasonOf(error: unknown): string {
  if (error instanceof QuantityError) {
    return error.reason.includes(`"${error.input}"`)
      ? error.reason
      : `${error.reason} ("${error.input}")`;
  }
  if (error instanceof DateTimeError) return error.message;
  throw error;
}

/**
 * Every point of the log, oldest first. Local date-times are read in `timeZone`; throws
 * LoggerCsvError at the first line it cannot read, or when the file holds no point.
 */
export function parseLoggerCsv(text: string, timeZone: string): LoggedPoint[] {
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/);
  const firstIndex = lines.findIndex((line) => line.trim() !== '');
  if (firstIndex === -1) throw new LoggerCsvError(1, 'the file holds no readings');
  const delimiter = lines[firstIndex].includes(';') ? ';' : ',';
  const decimalComma = delimiter === ';';
  const first = cells(lines[firstIndex], delimiter);
  const isHeader = first.some((cell) => /[a-z]{3,}/i.test(cell) && !/\d/.test(cell));
  const layout = isHeader ? headerLayout(first) : bareLayout(first);
  if (!layout) {
    throw new LoggerCsvError(
      firstIndex + 1,
      isHeader
        ? 'cannot find the time and temperature columns in the header'
        : 'expected two columns, time and temperature (or an index first)',
    );
  }
  const points: { ms: number; value: Decimal; enteredAs: string }[] = [];
  let previous: number | undefined;
  for (let index = isHeader ? firstIndex + 1 : firstIndex; index < lines.length; index++) {
    const line = lines[index];
    if (line.trim() === '') continue;
    const row = cells(line, delimiter);
    const number = index + 1;
    if (layout.width !== null && row.length !== layout.width) {
      throw new LoggerCsvError(number, `expected ${layout.width} columns, found ${row.length}`);
    }
    const needed = Math.max(layout.time, layout.temperature, layout.date ?? 0);
    if (row.length <= needed) {
      throw new LoggerCsvError(
        number,
        `expected at least ${needed + 1} columns, found ${row.length}`,
      );
    }
    try {
      const when =
        layout.date === null ? row[layout.time] : `${row[layout.date]} ${row[layout.time]}`;
      const ms = readLoggerDateTime(when, timeZone, previous);
      const [value, enteredAs] = readTemperature(row[layout.temperature], layout, decimalComma);
      points.push({ ms, value, enteredAs });
      previous = ms;
    } catch (error) {
      throw new LoggerCsvError(number, reasonOf(error));
    }
  }
  if (points.length === 0) throw new LoggerCsvError(lines.length, 'the file holds no readings');
  return points
    .map((point, order) => ({ ...point, order }))
    .sort((a, b) => a.ms - b.ms || a.order - b.order)
    .map((point) => ({
      at: new Date(point.ms).toISOString(),
      value: point.value.toString(),
      enteredAs: point.enteredAs,
    }));
}
