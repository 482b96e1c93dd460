import { contentWarning, type ContentProblem } from '../formula/formula-problem.ts';
import type { FormulaSpecies } from '../formula/formula-types.ts';

/**
 * Asks for the species of a formula whose cooking temperature depends on it (cures and blends).
 * A warning, not an error: without it the sheet already prints the highest temperature of the
 * chart, poultry's, which is safe for any meat, so files written before the key keep working
 * while the kitchen adds one line to each.
 */
export function checkSpecies(species: FormulaSpecies | undefined): ContentProblem[] {
  if (species !== undefined) return [];
  return [
    contentWarning(
      ['kind'],
      'say which meat this is with species: beef, pork, lamb, veal or poultry (a list such as ' +
        '[pork, beef] for a mixture); until then the sheet asks for 74 °C (165 °F), the ' +
        'temperature for poultry, whatever the meat',
    ),
  ];
}
