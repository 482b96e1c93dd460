import type { FormulaSpecies, Species } from '../../../shared/formula/formula-types.ts';

/** What the species select holds: the meats chosen, or `mixed` for a mixture not named. */
export type SpeciesWord = Species | 'mixed';

/** A formula's species as the select shows it: none, one, or each meat of a mixture. */
export function speciesChoices(species: FormulaSpecies | undefined): SpeciesWord[] {
  if (species === undefined) return [];
  return Array.isArray(species) ? [...species] : [species];
}

/**
 * The species to write from the select: none, one word, or the list of meats in a mixture.
 * Named meats win over `mixed`, since they give the sheet the right temperature.
 */
export function speciesFromChoices(chosen: readonly SpeciesWord[]): FormulaSpecies | undefined {
  const meats = chosen.filter((word): word is Species => word !== 'mixed');
  if (meats.length === 0) return chosen.includes('mixed') ? 'mixed' : undefined;
  return meats.length === 1 ? meats[0] : meats;
}
