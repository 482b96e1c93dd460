import { checkBlendFormula } from '../calculation/blend/check-blend-formula.ts';
import { checkCureFormula } from '../calculation/cure/check-cure-formula.ts';
import { checkDoughFormula } from '../calculation/dough/check-dough-formula.ts';
import { checkMixFormula } from '../calculation/mix/check-mix-formula.ts';
import { checkSpecies } from '../calculation/check-species.ts';
import { checkAssemblyFormula } from '../calculation/plan/check-assembly-formula.ts';
import { checkControls } from '../process/check-controls.ts';
import type { ContentProblem } from './formula-problem.ts';
import type { Formula } from './formula-types.ts';

/**
 * The checks a schema cannot express, for a formula that already matches the schema; cures and
 * blends are asked for their species, which sets their cooking temperature. An
 * assembly's references to other formulas are checked across files by checkLibrary(). Every
 * kind's process controls are checked (checkControls).
 */
export function checkFormulaContent(formula: Formula): ContentProblem[] {
  return [...kindProblems(formula), ...checkControls(formula)];
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
