/** Steps a kitchen clock is read in, in minutes: a tick falls on :05, :15, :30, the hour… */
const CLOCK_STEPS = [1, 2, 5, 10, 15, 30, 60, 120, 180, 240, 360, 720, 1440];
const MINUTE = 60_000;

/**
 * Ticks for a time axis on round clock times (12:30, 13:00, 13:30 rather than 12:50, 16:23):
 * the smallest clock step that gives at most `most` ticks between `from` and `to` (ms).
 * @param offsetMs the kitchen zone's offset from UTC at `from` (east positive), so an hour's tick
 *   falls on the hour there even in a zone half an hour off UTC
 */
export function clockTicks(from: number, to: number, offsetMs: number, most = 7): number[] {
  if (!(to > from)) return [from];
  const minutes =
    CLOCK_STEPS.find((m) => (to - from) / (m * MINUTE) <= most) ?? CLOCK_STEPS.at(-1)!;
  const step = minutes * MINUTE;
  const ticks: number[] = [];
  for (let t = Math.ceil((from + offsetMs) / step) * step - offsetMs; t <= to; t += step)
    ticks.push(t);
  return ticks;
}
