/**
 * The FSIS Appendix A time-at-temperature table for cooked beef, roast beef and cooked corned
 * beef, as hold rows (°C exact from °F, seconds).
 */
import { Decimal } from '../decimal.ts';
import { fahrenheitToCelsius } from '../units/temperature.ts';
import type { HoldRow } from './control-types.ts';

/** Which column of the table: the log reduction of Salmonella it gives. */
export type LethalityColumn = '6.5-log' | '7-log';

// source: USDA FSIS, "Compliance Guidelines for Meeting Lethality Performance Standards for
// Certain Meat and Poultry Products" (Appendix A, 1999), time-temperature table for cooked beef,
// roast beef and cooked corned beef (kept in the Revised Appendix A, Dec. 2021). Each row:
// minimum internal °F, then the time at or above it for 6.5-log and for 7-log, with its unit.
const TABLE: readonly (readonly [number, number, number, 'min' | 's'])[] = [
  [130, 112, 121, 'min'],
  [131, 89, 97, 'min'],
  [132, 71, 77, 'min'],
  [133, 56, 62, 'min'],
  [134, 45, 47, 'min'],
  [135, 36, 37, 'min'],
  [136, 28, 32, 'min'],
  [137, 23, 24, 'min'],
  [138, 18, 19, 'min'],
  [139, 15, 15, 'min'],
  [140, 12, 12, 'min'],
  [141, 9, 10, 'min'],
  [142, 8, 8, 'min'],
  [143, 6, 6, 'min'],
  [144, 5, 5, 'min'],
  [145, 4, 4, 'min'],
  [146, 169, 182, 's'],
  [147, 134, 144, 's'],
  [148, 107, 115, 's'],
  [149, 85, 91, 's'],
  [150, 67, 72, 's'],
  [151, 54, 58, 's'],
  [152, 43, 46, 's'],
  [153, 34, 37, 's'],
  [154, 27, 29, 's'],
  [155, 22, 23, 's'],
  [156, 17, 19, 's'],
  [157, 14, 15, 's'],
  [158, 0, 0, 's'],
];

/** The table's rows for one column, coolest first. */
export function appendixAHoldRows(column: LethalityColumn): HoldRow[] {
  return TABLE.map(([degreesF, time65, time7, unit]) => {
    const time = column === '6.5-log' ? time65 : time7;
    return {
      tempC: fahrenheitToCelsius(new Decimal(degreesF)).toString(),
      holdS: String(unit === 'min' ? time * 60 : time),
    };
  });
}
