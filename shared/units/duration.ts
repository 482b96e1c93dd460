import { Decimal } from '../decimal.ts';
import { parseWithTable, spellings, type UnitTable } from './unit-table.ts';

const DURATION: UnitTable = {
  factors: new Map([
    ...spellings(['s', 'sec', 'secs', 'second', 'seconds'], new Decimal(1)),
    ...spellings(['min', 'mins', 'minute', 'minutes'], new Decimal(60)),
    ...spellings(['h', 'hr', 'hrs', 'hour', 'hours'], new Decimal(3600)),
  ]),
  expected: 'a time such as "17 s", "30 min", "1.5 h" or "1 h 30 min"',
  noun: 'time',
  unitHint: 's, min or h',
};

/**
 * Reads a length of time and returns it in seconds. Several terms add up ("1 h 30 min").
 * @throws QuantityError when the text is not a length of time
 */
export function parseDuration(text: string): Decimal {
  return parseWithTable(text, DURATION);
}
