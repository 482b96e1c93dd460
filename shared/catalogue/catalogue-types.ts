/**
 * TypeScript shapes of the catalogue of materials (catalogue.yaml beside the formulas). They
 * mirror shared/schema/catalogue.schema.json, which is the authority.
 */
import type { Allergen } from '../formula/formula-types.ts';

/** What sort of material an item is. */
export type ItemKind =
  | 'meat'
  | 'poultry'
  | 'seafood'
  | 'curing-salt'
  | 'salt'
  | 'sugar'
  | 'spice'
  | 'flour'
  | 'dairy'
  | 'egg'
  | 'fat'
  | 'yeast'
  | 'water'
  | 'sauce'
  | 'additive'
  | 'other';

/** The unit an item is stocked and received in. */
export type StockUnit = 'g' | 'kg' | 'oz' | 'lb' | 'ml' | 'l' | 'each';

/** One material the formulas use. */
export interface CatalogueItem {
  /** Short name a formula line gives as `item:`. */
  key: string;
  /** The name as it appears on a label. */
  name: string;
  /** Other names formula lines give it, matched however capitalised or spaced. */
  formula_names?: string[];
  kind: ItemKind;
  unit: StockUnit;
  /** A compound ingredient's own ingredients, in the order of the supplier's label. */
  sub_ingredients?: string[];
  allergens?: Allergen[];
  /** Sodium nitrite, % by weight: required for a curing salt. */
  nitrite?: number;
  /** Sodium nitrate, % by weight. */
  nitrate?: number;
  /** Kept at room temperature until opened: received with no temperature limit. */
  shelf_stable?: boolean;
  /** Fat, % by weight, of a meat trim or fat (15 for 85/15 trim), for the least-cost blend. */
  fat?: number;
  /**
   * What one weighs, for an item stocked by count ("50 g"), or a volume of it, for one stocked by
   * volume ("244 g per cup"): how a formula's grams are compared with its lots.
   */
  weighs?: string;
}

/** The catalogue file. */
export interface Catalogue {
  catalogue: 1;
  items: CatalogueItem[];
}
