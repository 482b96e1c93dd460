/**
 * The temperature a delivery must arrive at, by what sort of material it is, and a delivery
 * judged against it. Pure: the door reading comes in as text ("4 °C", "39 °F").
 */
import type { ItemKind } from '../catalogue/catalogue-types.ts';
import { Decimal } from '../decimal.ts';
import { temperatureWords } from '../process/control-words.ts';
import { controlTemplate } from '../process/control-templates.ts';
import { fahrenheitToCelsius, readTemperature } from '../units/temperature.ts';

/** Which receiving rule applies: chilled, shell eggs, frozen, or none (dry goods). */
export type ReceivingRule = 'refrigerated' | 'shell-eggs' | 'frozen' | 'none';

/** The limit a delivery is received against. */
export interface ReceivingLimit {
  readonly rule: ReceivingRule;
  /** The warmest it may arrive, exact °C as a decimal string; absent for frozen and dry goods. */
  readonly maxC?: string;
  /** The limit in a cook's words: "5 °C (41 °F) or colder", "frozen solid", "no temperature limit". */
  readonly words: string;
  /** The published rule, or null where none applies. */
  readonly source: string | null;
}

const FOOD_CODE = 'FDA Food Code 2022';

/** Kinds received chilled: raw meat, poultry, seafood and dairy are kept cold to be safe. */
const REFRIGERATED: readonly ItemKind[] = ['meat', 'poultry', 'seafood', 'dairy'];

// The receiving control's own limit, so the door and a formula's receiving control agree.
// source: FDA Food Code 2022, §3-202.11(A): refrigerated food received at 5 °C (41 °F) or below
const receivingCold = controlTemplate('receiving-cold');
const COLD_MAX_C =
  receivingCold?.limit.type === 'at-most'
    ? receivingCold.limit.max
    : fahrenheitToCelsius(new Decimal(41)).toString();

// source: FDA Food Code 2022, §3-202.11(C): shell eggs received in refrigerated equipment that
// keeps an ambient air temperature of 7 °C (45 °F) or less. The °F figure is taken exactly, as
// the other Food Code limits here are (45 °F = 7.22 °C).
const EGG_MAX_C = fahrenheitToCelsius(new Decimal(45)).toString();

/**
 * The receiving limit of an item: refrigerated meat, poultry, seafood and dairy at 5 °C (41 °F)
 * or colder (Food Code §3-202.11(A)); shell eggs in air at 7.2 °C (45 °F) or colder (§3-202.11(C));
 * anything labelled and shipped frozen received frozen (§3-202.11(E)); dry goods and anything
 * kept at room temperature until opened (salt, curing salt, sugar, spice, flour, yeast, bottled
 * sauces, dry milk) carry no temperature limit.
 *
 * Milk may also be received at the temperature its own law sets (§3-202.11(B), from memory); we
 * hold it to the stricter 5 °C.
 * @param kind the catalogue item's kind
 * @param shippedFrozen whether the product is labelled and shipped frozen
 * @param shelfStable whether the catalogue marks the item as kept at room temperature until opened
 */
export function receivingLimit(
  kind: ItemKind,
  shippedFrozen: boolean,
  shelfStable = false,
): ReceivingLimit {
  if (shippedFrozen)
    return {
      rule: 'frozen',
      words: 'frozen solid',
      // source: FDA Food Code 2022, §3-202.11(E): food labelled frozen and shipped frozen by a
      // food processing plant shall be received frozen
      source: `${FOOD_CODE}, §3-202.11(E) Frozen food received frozen`,
    };
  if (kind === 'egg' && !shelfStable)
    return {
      rule: 'shell-eggs',
      maxC: EGG_MAX_C,
      words: `${temperatureWords(EGG_MAX_C)} or colder, air temperature`,
      source: `${FOOD_CODE}, §3-202.11(C) Shell eggs received at 45 °F air temperature`,
    };
  if (REFRIGERATED.includes(kind) && !shelfStable)
    return {
      rule: 'refrigerated',
      maxC: COLD_MAX_C,
      words: `${temperatureWords(COLD_MAX_C)} or colder`,
      source: `${FOOD_CODE}, §3-202.11(A) Receiving temperature`,
    };
  return { rule: 'none', words: 'no temperature limit', source: null };
}

/** What the cook found at the door. */
export interface DoorObservation {
  /** The temperature read, as typed: "4 °C", "39 °F". */
  readonly temperature?: string;
  /** For a product shipped frozen: whether it arrived frozen solid. */
  readonly frozenSolid?: boolean;
}

/** A delivery judged against its receiving limit. */
export interface ReceivingJudgement {
  readonly limit: ReceivingLimit;
  /** The reading in °C, or null when none was taken. */
  readonly temperatureC: Decimal | null;
  /** Whether it met its limit. */
  readonly within: boolean;
  /** What was found, in a cook's words: "8 °C (46 °F): over its limit of 5 °C (41 °F) or colder". */
  readonly words: string;
}

/** Why a delivery cannot be judged: what is missing. */
export class ReceivingInputError extends Error {
  constructor(
    readonly field: 'temperature' | 'frozenSolid',
    message: string,
  ) {
    super(message);
    this.name = 'ReceivingInputError';
  }
}

/**
 * Judges a delivery at the door. A chilled product needs a reading, compared unrounded with its
 * limit ("at or below" is within); a frozen one needs the cook's word that it arrived frozen
 * solid, and any reading is kept as written but not judged (the Food Code gives no figure for
 * "frozen"); dry goods are always within.
 * @throws ReceivingInputError when a reading or the frozen observation the rule needs is missing
 * @throws QuantityError when the reading is not a temperature
 */
export function judgeReceiving(
  limit: ReceivingLimit,
  observation: DoorObservation,
): ReceivingJudgement {
  const text = observation.temperature?.trim();
  const temperatureC = text ? readTemperature(text).celsius : null;
  const read = temperatureC === null ? '' : `${temperatureWords(temperatureC)}: `;
  switch (limit.rule) {
    case 'none':
      return { limit, temperatureC, within: true, words: `${read}no temperature limit` };
    case 'frozen': {
      if (observation.frozenSolid === undefined)
        throw new ReceivingInputError(
          'frozenSolid',
          'say whether the product arrived frozen solid',
        );
      const within = observation.frozenSolid;
      return {
        limit,
        temperatureC,
        within,
        words: within
          ? `${read}arrived frozen solid`
          : `${read}not frozen solid: a product shipped frozen must arrive frozen`,
      };
    }
    case 'refrigerated':
    case 'shell-eggs': {
      if (temperatureC === null)
        throw new ReceivingInputError('temperature', 'take the temperature of the delivery');
      const within = temperatureC.lessThanOrEqualTo(limit.maxC!);
      return {
        limit,
        temperatureC,
        within,
        words: within
          ? `${read}within its limit of ${limit.words}`
          : `${read}over its limit of ${limit.words}`,
      };
    }
  }
}
