import { checkBlendFormula } from '../calculation/blend/check-blend-formula.ts';
import { checkCureFormula } from '../calculation/cure/check-cure-formula.ts';
import { checkDoughFormula } from '../calculation/dough/check-dough-formula.ts';
import { checkMixFormula } from '../calculation/mix/check-mix-formula.ts';
import { checkSpecies } from '../calculation/check-species.ts';
import { checkAssemblyFormula } from '../calculation/plan/check-assembly-formula.ts';
import { checkControls } from '../process/check-controls.ts';
import { CATALOGUE_FILE, CATALOGUE_ID } from '../catalogue/catalogue-file.ts';
import { contentError, type ContentProblem } from './formula-problem.ts';
import type { Formula } from './formula-types.ts';

/**
 * The checks a schema cannot express, for a formula that already matches the schema; cures and
 * blends are asked for their species, which sets their cooking temperature. An
 * assembly's references to other formulas are checked across files by checkLibrary(). Every
 * kind's process controls are checked (checkControls).
 */
export function checkFormulaContent(formula: Formula): ContentProblem[] {
  return [...idProblems(formula), ...kindProblems(formula), ...checkControls(formula)];
}

/** The catalogue's name is kept: a formula with its id would be filed as catalogue.yaml. */
function idProblems(formula: Formula): ContentProblem[] {
  return formula.id === CATALOGUE_ID
    ? [
        contentError(
          ['id'],
          `the id "${formula.id}" is kept for the catalogue of materials (${CATALOGUE_FILE}); give the formula another`,
        ),
      ]
    : [];
}

function kindProblems(formula: Formula): ContentProblem[] {
  switch (formula.kind) {
    case 'cure':
      return [...checkSpecies(formula.species), ...checkCureFormula(formula)];
    case 'dough':
      return checkDoughFormula(formula);
    case 'blend':
      return [...checkSpecies(formula.species), ...checkBlendFormula(formula)];
    case 'mix':
      return checkMixFormula(formula);
    case 'assembly':
      return checkAssemblyFormula(formula);
  }
}
