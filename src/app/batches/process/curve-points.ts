import type { ControlLimit, Reading } from './process-types';

/** One point of a curve: milliseconds since 1970 and °C, as a canvas draws it. */
export interface CurvePoint {
  readonly x: number;
  readonly y: number;
}

/** A part of the critical limit drawn on the chart, apart from the readings. */
export interface LimitBand {
  /** Words for the legend and the screen reader: "Stage 1: 26.7 °C by 14:32". */
  readonly label: string;
  /** A shaded range between two lines, a line the product must keep to, or a stage's window. */
  readonly kind: 'range' | 'line' | 'stage';
  /** The line's points, left to right (a stage: its target to its deadline, then the drop). */
  readonly points: readonly CurvePoint[];
  /** A range's other edge, for the shading. */
  readonly other?: readonly CurvePoint[];
}

/**
 * The standing readings as points, oldest first. The numbers are for drawing only: the judging
 * of the readings against the limit is the server's, on exact decimals.
 */
export function curvePoints(readings: readonly Reading[]): CurvePoint[] {
  return readings
    .filter((reading) => reading.correctedBy === null)
    .map((reading) => ({ x: new Date(reading.at).getTime(), y: Number(reading.value) }))
    .filter((point) => Number.isFinite(point.x) && Number.isFinite(point.y))
    .sort((a, b) => a.x - b.x);
}

/** One stage of a cool as the curve shows it: when it began, its deadline, and when it got there. */
export interface CoolingWindow {
  readonly index: number;
  readonly toC: number;
  readonly fromC: number;
  readonly start: number;
  readonly deadline: number;
  /** When a reading first showed the stage's target; null while it has not. */
  readonly reached: number | null;
}

/**
 * The windows of a staged cool for drawing, following the contract's rule: the clock starts at
 * the last reading at or above the first stage's `from` before the first reading below it (or at
 * the first reading when that is already below); each stage ends at the first reading at or
 * below its target, and the next begins there.
 */
export function coolingWindows(
  limit: Extract<ControlLimit, { type: 'cooling' }>,
  points: readonly CurvePoint[],
): CoolingWindow[] {
  const first = limit.stages[0];
  if (!first || points.length === 0) return [];
  const below = points.findIndex((p) => p.y < Number(first.fromC));
  if (below < 0) return [];
  const coolStart = points[Math.max(0, below - 1)].x;
  const windows: CoolingWindow[] = [];
  let stageStart: number | null = coolStart;
  limit.stages.forEach((stage, index) => {
    // A stage not yet begun (the one before has not reached its target) has no window yet.
    if (stageStart === null) return;
    const deadline =
      (stage.countedFrom === 'cooling-start' ? coolStart : stageStart) +
      Number(stage.withinS) * 1000;
    const from = stageStart;
    const hit = points.find((p) => p.x >= from && p.y <= Number(stage.toC));
    windows.push({
      index,
      toC: Number(stage.toC),
      fromC: Number(stage.fromC),
      start: stageStart,
      deadline,
      reached: hit?.x ?? null,
    });
    stageStart = hit?.x ?? null;
  });
  return windows;
}

/**
 * The limit as bands across the chart's time span: a range shaded between its edges, a maximum
 * or minimum as a line, a hold's temperature as a line, and each stage of a cool as its target
 * up to its deadline with a drop at the deadline (before the cool starts: the targets as lines).
 * @param words how a °C figure and a time are said on the labels
 */
export function limitBands(
  limit: ControlLimit,
  points: readonly CurvePoint[],
  span: { readonly from: number; readonly to: number },
  words: { readonly temp: (c: string) => string; readonly clock: (ms: number) => string },
): LimitBand[] {
  const across = (y: number): CurvePoint[] => [
    { x: span.from, y },
    { x: span.to, y },
  ];
  switch (limit.type) {
    case 'at-most':
      return [
        { label: `At most ${words.temp(limit.max)}`, kind: 'line', points: across(+limit.max) },
      ];
    case 'at-least':
      return [
        { label: `At least ${words.temp(limit.min)}`, kind: 'line', points: across(+limit.min) },
      ];
    case 'between':
      return [
        {
          label: `Between ${words.temp(limit.min)} and ${words.temp(limit.max)}`,
          kind: 'range',
          points: across(+limit.max),
          other: across(+limit.min),
        },
      ];
    case 'hold': {
      const row = limit.rows[0];
      return row
        ? [
            {
              label: `Must reach ${words.temp(row.tempC)}`,
              kind: 'line',
              points: across(+row.tempC),
            },
          ]
        : [];
    }
    case 'cooling': {
      const windows = coolingWindows(limit, points);
      if (windows.length === 0)
        return limit.stages.map((stage, index) => ({
          label: `Stage ${index + 1}: down to ${words.temp(stage.toC)}`,
          kind: 'line',
          points: across(+stage.toC),
        }));
      return windows.map((w) => ({
        label: `Stage ${w.index + 1}: ${words.temp(String(w.toC))} by ${words.clock(w.deadline)}`,
        kind: 'stage',
        points: [
          { x: w.start, y: w.toC },
          { x: w.deadline, y: w.toC },
          { x: w.deadline, y: w.fromC },
        ],
      }));
    }
  }
}
