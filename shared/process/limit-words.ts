/**
 * A critical limit in words for records (the HACCP report): the same words for a temperature and
 * a length of time as the judging's summaries (control-words.ts).
 */
import { Decimal } from '../decimal.ts';
import type { CanonicalUnit, ControlLimit } from './control-types.ts';
import { durationWords, temperatureWords, valueWords } from './control-words.ts';

/** A cooling limit's stages, each with what its time is counted from. */
function coolingWords(limit: Extract<ControlLimit, { type: 'cooling' }>): string {
  return limit.stages
    .map((stage, i) => {
      const counted =
        stage.countedFrom === 'cooling-start'
          ? ' of the start of cooling'
          : i === 0
            ? ''
            : ` of reaching ${temperatureWords(limit.stages[i - 1].toC)}`;
      const from = i === 0 ? `from ${temperatureWords(stage.fromC)} ` : '';
      return `${from}to ${temperatureWords(stage.toC)} within ${durationWords(stage.withinS)}${counted}`;
    })
    .join('; then ');
}

/**
 * "at most 5 °C (41 °F)", "68.3 °C (155 °F) for 17 s, or …", "from 54.4 °C (130 °F) to 26.7 °C
 * (80 °F) within 1 h 30 min; then to 4.4 °C (40 °F) within 5 h of reaching 26.7 °C (80 °F)".
 */
export function limitWords(limit: ControlLimit, unit: CanonicalUnit): string {
  switch (limit.type) {
    case 'at-most':
      return `at most ${valueWords(limit.max, unit)}`;
    case 'at-least':
      return `at least ${valueWords(limit.min, unit)}`;
    case 'between':
      return `from ${valueWords(limit.min, unit)} to ${valueWords(limit.max, unit)}`;
    case 'hold':
      return limit.rows
        .map((row) =>
          new Decimal(row.holdS).isZero()
            ? `${temperatureWords(row.tempC)} reached`
            : `${temperatureWords(row.tempC)} for ${durationWords(row.holdS)}`,
        )
        .join(', or ');
    case 'cooling':
      return coolingWords(limit);
  }
}
