import type { Catalogue } from '../catalogue/catalogue-types.ts';
import type { Decimal } from '../decimal.ts';
import type { Allergen, Formula, LabelKeeping } from '../formula/formula-types.ts';
import { materialLines } from '../catalogue/formula-lines.ts';
import { linkLines } from '../catalogue/link-catalogue.ts';
import type { PresentedResult } from '../presentation/presented-result.ts';
import type { ProductLabelView } from '../api/product-label-view.ts';
import { allergenStatement } from './allergen-statement.ts';
import { ingredientStatement, type IngredientStatement } from './ingredient-statement.ts';
import { labelIngredients } from './label-ingredients.ts';
import { SHORTEN_ADDRESS_WORDS } from './label-lettering.ts';
import { LABEL_SIZES, labelSizeRefusal, type LabelSize } from './label-sizes.ts';
import { keepStatement, useByOf, type KeepStatement, type UseBy } from './label-keeping.ts';
import { netWeight, type NetWeight } from './net-weight.ts';
import { safeHandling, type SafeHandling } from './safe-handling.ts';
import {
  SHI_HEADING,
  SHI_RATIONALE,
  SHI_STATEMENTS,
  type ShiStatement,
} from './safe-handling-text.ts';

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

/** The safe handling instructions as a label prints them (shared/labels/safe-handling-text.ts). */
export interface SafeHandlingInstructions {
  readonly heading: string;
  readonly rationale: string;
  readonly statements: readonly ShiStatement[];
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
  /** The use-by day, or why there is none. */
  readonly useBy: UseBy;
  /** "Keep refrigerated" or "Keep frozen"; none for a shelf-stable product or one not set. */
  readonly handling?: KeepStatement;
  readonly safeHandling: SafeHandling;
  /** The safe handling instructions word for word, when they are required. */
  readonly instructions?: SafeHandlingInstructions;
  readonly kitchen: ProductLabelInput['kitchen'];
  /**
   * Where the net weight comes from when the label works it out (one unit of an assembly), or
   * why it cannot, in a cook's words; undefined for a net weight the cook gives.
   */
  readonly netNote?: string;
}

/** What a label says that is worked out from its product, before the package's own facts. */
export interface LabelContent {
  readonly product: string;
  readonly ingredients: IngredientStatement;
  readonly contains?: string;
  readonly net?: NetWeight;
  readonly netNote?: string;
  readonly useBy: UseBy;
  readonly storage?: LabelKeeping['storage'];
  readonly safeHandling: SafeHandling;
}

/**
 * A label from its worked-out content and the package's facts: the keep statement for how it is
 * stored, and the safe handling instructions word for word when they are required.
 */
export function labelOf(
  content: LabelContent,
  facts: Pick<ProductLabelInput, 'lotCode' | 'packedOn' | 'kitchen'>,
): ProductLabel {
  const { storage, ...rest } = content;
  return {
    ...rest,
    lotCode: facts.lotCode,
    packedOn: facts.packedOn,
    handling: keepStatement(storage),
    instructions: content.safeHandling.required
      ? { heading: SHI_HEADING, rationale: SHI_RATIONALE, statements: SHI_STATEMENTS }
      : undefined,
    kitchen: facts.kitchen,
  };
}

/**
 * Every allergen list behind a formula's lines: what each line declares, and what its catalogue
 * item holds (a line may not declare its item's allergens; check warns of that, the label must
 * not miss them).
 */
export function labelAllergens(
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

/**
 * The content of a product label for a recorded batch: the formula's title as the product's
 * name, the ingredient statement from the batch's weights and the catalogue's names, the
 * "Contains:" statement, the net weight in US and metric units, the lot code, the packed-on day
 * the use-by day (the formula's validated shelf life, or the Food Code's 7 days for a ready-to-eat
 * refrigerated product, or none: label-keeping.ts), "Keep refrigerated" or "Keep frozen" when
 * the formula says it is so stored, the safe handling instructions when the product is raw or
 * not-ready-to-eat meat or poultry, and the kitchen.
 * @throws RangeError for a packed-on day that is not a calendar date, or a net weight of nothing
 */
export function productLabel(input: ProductLabelInput): ProductLabel {
  const keeping = input.formula.label;
  return labelOf(
    {
      product: input.formula.title,
      ingredients: ingredientStatement(
        labelIngredients(input.formula, input.result, input.catalogue),
      ),
      contains: allergenStatement(labelAllergens(input.formula, input.catalogue)),
      net: input.netGrams === undefined ? undefined : netWeight(input.netGrams),
      useBy: useByOf(keeping, input.packedOn),
      storage: keeping?.storage,
      safeHandling: safeHandling(input.formula),
    },
    input,
  );
}

/**
 * Why the 4 × 6 label is refused, in a cook's words, as the preview offers it: its own reason,
 * and what to do when something can be done (the kitchen's address on one line). When nothing
 * can and the small sizes are refused too, no size carries the label: a dish served from the
 * kitchen needs no package label (FDA Food Code 2022, 3-602.11(A): food "packaged in a food
 * establishment" is labeled; from memory), which is what the demo burger is.
 * @param tooFull why the 4 × 6 label cannot hold this content
 * @param smallRefused whether the small sizes are refused as well
 */
export function noSizeFits(tooFull: string, smallRefused: boolean): string {
  if (!smallRefused || tooFull.endsWith(SHORTEN_ADDRESS_WORDS))
    return tooFull.charAt(0).toUpperCase() + tooFull.slice(1);
  return (
    `This label is too long for any size we print: ${tooFull.charAt(0).toLowerCase()}` +
    `${tooFull.slice(1)}, and the small labels have no room for the safe handling instructions. ` +
    'A dish you serve rather than pack, such as a burger from the grill, needs no package label'
  );
}

/**
 * A label's content as the API sends it (shared/api/product-label-view.ts), with every size and
 * why this product cannot go on it, if it cannot.
 * @param tooFull why the 4 × 6 label cannot hold this content, when it cannot (found by laying it
 *   out, which only the PDF stack can)
 * @param stickerTooFull why the lot and date sticker cannot hold its words, when it cannot (found
 *   the same way); the small sizes all print it
 */
export function productLabelView(
  label: ProductLabel,
  tooFull?: string,
  stickerTooFull?: string,
): ProductLabelView {
  const shiRefusal = (size: LabelSize) =>
    labelSizeRefusal(size, label.safeHandling.required, !tooFull);
  return {
    product: label.product,
    ingredients: label.ingredients.text,
    contains: label.contains,
    net: label.net?.text,
    lotCode: label.lotCode,
    packedOn: label.packedOn,
    useBy: label.useBy.mark
      ? { day: label.useBy.mark.useBy, source: label.useBy.mark.source }
      : { none: label.useBy.none ?? '' },
    handling: label.handling,
    safeHandling: label.safeHandling,
    instructions: label.instructions,
    kitchen: label.kitchen,
    netNote: label.netNote,
    sizes: LABEL_SIZES.map((size) => {
      // noSizeFits speaks of the safe handling instructions: only their refusal is told it.
      const refused =
        size === '4x6'
          ? tooFull && noSizeFits(tooFull, shiRefusal('2x1') !== undefined)
          : (shiRefusal(size) ?? stickerTooFull);
      return refused ? { size, refused } : { size };
    }),
  };
}
