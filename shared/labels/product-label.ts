import type { Catalogue } from '../catalogue/catalogue-types.ts';
import type { Decimal } from '../decimal.ts';
import type { Allergen, Formula } from '../formula/formula-types.ts';
import { materialLines } from '../catalogue/formula-lines.ts';
import { linkLines } from '../catalogue/link-catalogue.ts';
import type { PresentedResult } from '../presentation/presented-result.ts';
import { allergenStatement } from './allergen-statement.ts';
import { dateMark, type DateMark } from './date-mark.ts';
import { ingredientStatement, type IngredientStatement } from './ingredient-statement.ts';
import { labelIngredients } from './label-ingredients.ts';
import { netWeight, type NetWeight } from './net-weight.ts';

/**
 * The handling statement of a perishable product.
 * source (from memory, re-check against eCFR): 9 CFR 317.2(k), perishable meat products "shall
 * be labeled with the statement 'Keep Refrigerated'" or a like statement; 9 CFR 381.125(a) for
 * poultry.
 */
export const KEEP_REFRIGERATED = 'Keep refrigerated';

/** What a product label is worked out from. */
export interface ProductLabelInput {
  /** The formula at the revision the batch was calculated from. */
  readonly formula: Formula;
  /** The batch's recorded result: the weights the batch sheet printed. */
  readonly result: PresentedResult;
  readonly catalogue?: Catalogue;
  readonly lotCode: string;
  /** The day the product was packed (ISO date): day 1 of its date mark. */
  readonly packedOn: string;
  /** The package's net weight, grams; a small label may go without it. */
  readonly netGrams?: Decimal;
  /** The kitchen's name and, when it has given one, its address. */
  readonly kitchen: { readonly name: string; readonly address?: string };
}

/** Whether a product needs the safe handling instructions of raw meat and poultry, and why. */
export interface SafeHandling {
  readonly required: boolean;
  /** Why, in words for the record. */
  readonly reason: string;
}

/** The content of a product label, every text worked out; no layout. */
export interface ProductLabel {
  /** The product's name: the formula's title. */
  readonly product: string;
  readonly ingredients: IngredientStatement;
  /** "Contains: milk, fish (anchovy)", or undefined when no major allergen is in it. */
  readonly contains?: string;
  readonly net?: NetWeight;
  readonly lotCode: string;
  readonly packedOn: string;
  readonly useBy: DateMark;
  readonly handling: typeof KEEP_REFRIGERATED;
  readonly safeHandling: SafeHandling;
  readonly kitchen: ProductLabelInput['kitchen'];
}

/**
 * Every allergen list behind a formula's lines: what each line declares, and what its catalogue
 * item holds (a line may not declare its item's allergens; check warns of that, the label must
 * not miss them).
 */
function labelAllergens(
  formula: Formula,
  catalogue?: Catalogue,
): (readonly Allergen[] | undefined)[] {
  const declared = materialLines(formula).map((line) => line.allergens);
  if (!catalogue) return declared;
  const items = linkLines(formula, catalogue).map(({ index }) =>
    index === undefined ? undefined : catalogue.items[index]?.allergens,
  );
  return [...declared, ...items];
}

/** The process-control rules of an in-plant lethality step (FSIS Appendix A): a cooked product. */
const LETHALITY_RULE = /^fsis-lethality-/;

/**
 * Whether a batch of a formula is raw or not ready to eat meat or poultry, which must carry the
 * safe handling instructions: a cure or a blend of a named species whose controls have no
 * in-plant lethality step (FSIS Appendix A). A burger grind is raw; a cold-smoked bacon is cured
 * but not cooked; a ham cooked to a lethality control is ready to eat. A sauce or a dough is not
 * a meat or poultry product. A formula's lethality control is taken as the product's cook before
 * packing: common practice, no source.
 * source: FSIS Directive 10240.4, Resource 1 ("Chart of ready-to-eat vs not ready-to-eat
 * products"): a product containing meat or poultry "which has not received an adequate lethality
 * treatment for pathogens (i.e., raw or partially cooked product)" is not ready to eat, and "Use
 * of Safe Handling Instruction (SHI) labeling required"; 9 CFR 317.2(l) (meat) and 381.125(b)
 * (poultry).
 */
export function safeHandling(formula: Formula): SafeHandling {
  const meat = (formula.kind === 'cure' || formula.kind === 'blend') && formula.species;
  if (!meat) return { required: false, reason: 'not a meat or poultry product' };
  const cooked = (formula.controls ?? []).some((control) =>
    LETHALITY_RULE.test(control.rule ?? ''),
  );
  return cooked
    ? { required: false, reason: 'cooked to a lethality control before packing: ready to eat' }
    : {
        required: true,
        reason:
          formula.kind === 'blend'
            ? 'raw meat or poultry (9 CFR 317.2(l), 381.125(b))'
            : 'cured but not cooked to a lethality control: not ready to eat (9 CFR 317.2(l), 381.125(b))',
      };
}

/**
 * The content of a product label for a recorded batch: the formula's title as the product's
 * name, the ingredient statement from the batch's weights and the catalogue's names, the
 * "Contains:" statement, the net weight in US and metric units, the lot code, the packed-on day
 * and the use-by day by the Food Code's date marking (7 days, the packed day counted as day 1),
 * "Keep refrigerated", whether the safe handling instructions are required, and the kitchen.
 * The formula schema has no validated shelf life yet, so the use-by day is always the Food
 * Code's.
 * @throws RangeError for a packed-on day that is not a calendar date, or a net weight of nothing
 */
export function productLabel(input: ProductLabelInput): ProductLabel {
  const ingredients = ingredientStatement(
    labelIngredients(input.formula, input.result, input.catalogue),
  );
  const contains = allergenStatement(labelAllergens(input.formula, input.catalogue));
  return {
    product: input.formula.title,
    ingredients,
    contains,
    net: input.netGrams === undefined ? undefined : netWeight(input.netGrams),
    lotCode: input.lotCode,
    packedOn: input.packedOn,
    useBy: dateMark({ preparedOn: input.packedOn }),
    handling: KEEP_REFRIGERATED,
    safeHandling: safeHandling(input.formula),
    kitchen: input.kitchen,
  };
}
