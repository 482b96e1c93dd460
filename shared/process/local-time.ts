/**
 * Date-times as a logger writes them ("2026-03-02 14:05", "03/02/2026 2:05 PM", "02.03.2026
 * 14:05"), read in a kitchen's IANA time zone unless they carry their own zone.
 */

/** The fields of a wall-clock time. */
interface WallClock {
  readonly year: number;
  readonly month: number;
  readonly day: number;
  readonly hour: number;
  readonly minute: number;
  readonly second: number;
  readonly millisecond: number;
}

const ISO =
  /^(\d{4})-(\d{2})-(\d{2})[T ](\d{1,2}):(\d{2})(?::(\d{2})(?:\.(\d{1,3})\d*)?)?\s*(Z|[+-]\d{2}:?\d{2})?$/i;
const US = /^(\d{1,2})\/(\d{1,2})\/(\d{4})[ T,]+(\d{1,2}):(\d{2})(?::(\d{2}))?\s*([AP]\.?M\.?)?$/i;
const DOTTED = /^(\d{1,2})\.(\d{1,2})\.(\d{4})[ T,]+(\d{1,2}):(\d{2})(?::(\d{2}))?$/;

/** Thrown with the reason a date-time cannot be read. */
export class DateTimeError extends Error {
  override readonly name = 'DateTimeError';
}

// Building a formatter costs far more than using one: one per time zone, kept.
const clocks = new Map<string, Intl.DateTimeFormat>();

/**
 * The wall clock of an instant in a time zone (undefined: the zone this program runs in), to
 * the second.
 */
export function wallClockOf(
  instant: Date | number,
  timeZone: string | undefined,
): Omit<WallClock, 'millisecond'> {
  const key = timeZone ?? '';
  let clock = clocks.get(key);
  if (!clock) {
    clock = new Intl.DateTimeFormat('en-US', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: 'numeric',
      minute: 'numeric',
      second: 'numeric',
    });
    clocks.set(key, clock);
  }
  const parts = clock.formatToParts(instant);
  const field = (type: Intl.DateTimeFormatPartTypes): number =>
    Number(parts.find((part) => part.type === type)?.value ?? '0');
  return {
    year: field('year'),
    month: field('month'),
    day: field('day'),
    hour: field('hour') % 24,
    minute: field('minute'),
    second: field('second'),
  };
}

function offsetMs(utcMs: number, timeZone: string): number {
  const { year, month, day, hour, minute, second } = wallClockOf(utcMs, timeZone);
  const wall = Date.UTC(year, month - 1, day, hour, minute, second);
  return wall - Math.floor(utcMs / 1000) * 1000;
}

/** The wall-clock time's fields read as if they were UTC. */
function wallUtcMs(wall: WallClock): number {
  return Date.UTC(
    wall.year,
    wall.month - 1,
    wall.day,
    wall.hour,
    wall.minute,
    wall.second,
    wall.millisecond,
  );
}

/** "Z", "+01:00", "-0500" as milliseconds ahead of UTC. */
function zoneOffsetMs(zone: string): number {
  if (zone.toUpperCase() === 'Z') return 0;
  const digits = zone.replace(':', '');
  const sign = digits.startsWith('-') ? -1 : 1;
  return sign * (Number(digits.slice(1, 3)) * 60 + Number(digits.slice(3, 5))) * 60_000;
}

function checkFields(wall: WallClock): void {
  const daysInMonth = new Date(Date.UTC(wall.year, wall.month, 0)).getUTCDate();
  if (wall.month < 1 || wall.month > 12) throw new DateTimeError(`there is no month ${wall.month}`);
  if (wall.day < 1 || wall.day > daysInMonth) {
    throw new DateTimeError(`there is no day ${wall.day} in month ${wall.month} of ${wall.year}`);
  }
  if (wall.hour > 23 || wall.minute > 59 || wall.second > 59) {
    throw new DateTimeError('the time of day is out of range');
  }
}

/**
 * The instants a wall-clock time names in a zone: one, two when the clocks go back, none when
 * they go forward over it.
 */
function instantsOf(wall: WallClock, timeZone: string): number[] {
  const asUtc = wallUtcMs(wall);
  const candidates = new Set<number>();
  for (const probe of [asUtc - 86_400_000, asUtc, asUtc + 86_400_000]) {
    candidates.add(asUtc - offsetMs(probe, timeZone));
  }
  return [...candidates]
    .filter((instant) => instant + offsetMs(instant, timeZone) === asUtc)
    .sort((a, b) => a - b);
}

function fields(match: RegExpExecArray, order: [number, number, number]): WallClock {
  const [y, m, d] = order;
  return {
    year: Number(match[y]),
    month: Number(match[m]),
    day: Number(match[d]),
    hour: Number(match[4]),
    minute: Number(match[5]),
    second: Number(match[6] ?? '0'),
    millisecond: 0,
  };
}

/**
 * Milliseconds since the epoch of a logger's date-time. A time that happens twice (clocks going
 * back) is the first of the two not before `notBefore`, so a log in order stays in order.
 * @throws DateTimeError with the reason, in words
 */
export function readLoggerDateTime(text: string, timeZone: string, notBefore?: number): number {
  const trimmed = text.trim();
  let wall: WallClock;
  const iso = ISO.exec(trimmed);
  const us = iso ? null : US.exec(trimmed);
  const dotted = iso || us ? null : DOTTED.exec(trimmed);
  if (iso) {
    wall = { ...fields(iso, [1, 2, 3]), millisecond: Number((iso[7] ?? '0').padEnd(3, '0')) };
    checkFields(wall);
    if (iso[8]) return wallUtcMs(wall) - zoneOffsetMs(iso[8]);
  } else if (us) {
    wall = fields(us, [3, 1, 2]);
    const meridiem = us[7]?.toUpperCase().replace(/\./g, '');
    if (meridiem) {
      if (wall.hour < 1 || wall.hour > 12)
        throw new DateTimeError('with AM or PM the hour is 1–12');
      wall = { ...wall, hour: (wall.hour % 12) + (meridiem === 'PM' ? 12 : 0) };
    }
    checkFields(wall);
  } else if (dotted) {
    wall = fields(dotted, [3, 2, 1]);
    checkFields(wall);
  } else {
    throw new DateTimeError(
      `"${trimmed}" is not a date and time such as 2026-03-02 14:05, 03/02/2026 2:05 PM or ` +
        '02.03.2026 14:05',
    );
  }
  const instants = instantsOf(wall, timeZone);
  if (instants.length === 0) {
    throw new DateTimeError(`"${trimmed}" does not exist in ${timeZone}: the clocks went forward`);
  }
  return instants.find((instant) => notBefore === undefined || instant >= notBefore) ?? instants[0];
}
