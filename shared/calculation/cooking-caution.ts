import type { FormulaSpecies, Species } from '../formula/formula-types.ts';
import { CAUTIONS } from '../reference/cautions.ts';
import type { Caution } from './calc-result.ts';

/** How the meat is cooked: as whole cuts (bacon, hams, loins) or ground (sausage, grind). */
export type MeatForm = 'whole' | 'ground';

// The lines of the FSIS chart a meat can fall under, lowest temperature first:
// 145 °F, 160 °F, 165 °F (source: USDA FSIS Safe Minimum Internal Temperature Chart).
const LINES = [CAUTIONS.wholeCutCooking, CAUTIONS.groundMeatCooking, CAUTIONS.poultryCooking];

function lineOf(species: Species, form: MeatForm): number {
  if (species === 'poultry') return 2;
  return form === 'ground' ? 1 : 0;
}

/**
 * The cooking temperature for a formula's meat. A mixture takes the strictest line of the meats
 * listed in it; a mixture not named (`mixed`) or a formula without a species may hold poultry, so
 * it takes poultry's, the highest of the chart.
 */
export function cookingCaution(species: FormulaSpecies | undefined, form: MeatForm): Caution {
  if (species === undefined || species.length === 0) return CAUTIONS.unnamedMeatCooking;
  if (species === 'mixed') return CAUTIONS.unnamedMixtureCooking;
  const listed = Array.isArray(species) ? species : [species];
  return LINES[Math.max(...listed.map((one) => lineOf(one, form)))];
}
