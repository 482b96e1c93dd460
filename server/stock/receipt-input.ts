import type { ReceiptRequest } from '../../shared/api/receipt.ts';
import { isIsoDate } from '../../shared/calculation/dates.ts';
import type { CatalogueItem } from '../../shared/catalogue/catalogue-types.ts';
import { Decimal } from '../../shared/decimal.ts';
import { dayWords } from '../../shared/presentation/date-words.ts';
import { baseAmount } from '../../shared/stock/base-measure.ts';
import {
  ReceivingInputError,
  judgeReceiving,
  receivingLimit,
  type ReceivingJudgement,
} from '../../shared/stock/receiving-limit.ts';
import { QuantityError } from '../../shared/units/quantity-error.ts';
import { AppError } from '../http/app-error.ts';
import { itemWords } from '../../shared/catalogue/item-words.ts';

/** A delivery checked and worked out, ready to write. */
export interface CheckedReceipt {
  readonly item: CatalogueItem;
  /** The item in the words its formula lines give it ("pork belly"), else its label name. */
  readonly itemName: string;
  readonly establishment: string | null;
  readonly quantity: string;
  /** In the item's base measure. */
  readonly amount: string;
  readonly unitCost: string | null;
  readonly judgement: ReceivingJudgement;
  readonly decision: 'accepted' | 'accepted-with-action' | 'refused';
}

function refused(code: string, field: string, message: string, extra: object = {}): AppError {
  return new AppError(422, code, message, [{ field, message, ...extra }]);
}

/**
 * The USDA mark of inspection's establishment number as printed: "EST. 4821", "4821", "P-4821"
 * for poultry, a letter or two after the digits for a second plant. The shape is from memory.
 */
const ESTABLISHMENT = /^(EST\.?\s*)?(P-?)?\d{1,6}[A-Z]{0,2}$/;

/** Kinds that come from an inspected plant and carry its establishment number. */
const INSPECTED = new Set(['meat', 'poultry']);

function establishmentOf(request: ReceiptRequest, item: CatalogueItem): string | null {
  const text = request.establishment?.trim().toUpperCase().replace(/\s+/g, ' ') ?? '';
  if (!text) {
    if (INSPECTED.has(item.kind))
      throw refused(
        'establishment-needed',
        'establishment',
        `give the establishment number in the mark of inspection on the ${item.kind} ("EST. 4821", "P-4821")`,
      );
    return null;
  }
  if (!ESTABLISHMENT.test(text))
    throw refused(
      'bad-establishment',
      'establishment',
      `"${request.establishment}" is not an establishment number such as "EST. 4821" or "P-4821"`,
    );
  return text;
}

function dayOf(value: string | undefined, field: string, words: string): string | null {
  if (value === undefined || value === '') return null;
  if (!isIsoDate(value)) throw refused('bad-date', field, `the ${words} ${value} is not a day`);
  return value;
}

function decimalOf(text: string | undefined, field: string, words: string): string | null {
  const value = text?.trim();
  if (!value) return null;
  if (!/^\d+(\.\d+)?$/.test(value))
    throw refused('bad-number', field, `the ${words} "${text}" is not a number`);
  return new Decimal(value).toString();
}

/** The door's judgement, its missing inputs and unreadable readings as 422s. */
function judge(request: ReceiptRequest, item: CatalogueItem): ReceivingJudgement {
  const limit = receivingLimit(item.kind, request.shippedFrozen === true, item.shelf_stable);
  try {
    return judgeReceiving(limit, {
      ...(request.temperature === undefined ? {} : { temperature: request.temperature }),
      ...(request.frozenSolid === undefined ? {} : { frozenSolid: request.frozenSolid }),
    });
  } catch (error) {
    if (error instanceof ReceivingInputError)
      throw refused(
        `${error.field === 'temperature' ? 'temperature' : 'frozen'}-needed`,
        error.field,
        error.message,
      );
    if (error instanceof QuantityError)
      throw refused('bad-temperature', 'temperature', error.message);
    throw error;
  }
}

/**
 * Checks a delivery against its catalogue item and the day it arrives, and judges it at the
 * door. Over its limit it must say what was done: refused, or taken in with a corrective
 * action (checked by the deviation code when it is written).
 * @throws AppError 422: 'establishment-needed', 'bad-establishment', 'bad-date', 'bad-dates',
 *   'bad-number', 'bad-quantity', 'temperature-needed', 'frozen-needed', 'bad-temperature',
 *   'past-use-by', 'note-needed', 'decision-needed', 'action-needed', 'no-deviation'
 */
export function checkReceipt(
  request: ReceiptRequest,
  item: CatalogueItem,
  receivedOn: string,
): CheckedReceipt {
  const establishment = establishmentOf(request, item);
  const packedOn = dayOf(request.packedOn, 'packedOn', 'pack or kill day');
  const useBy = dayOf(request.useBy, 'useBy', 'use-by');
  if (packedOn && packedOn > receivedOn)
    throw refused(
      'bad-dates',
      'packedOn',
      `the pack or kill day ${dayWords(packedOn)} is after today`,
    );
  if (packedOn && useBy && useBy < packedOn)
    throw refused(
      'bad-dates',
      'useBy',
      `the use-by ${dayWords(useBy)} is before the pack or kill day`,
    );
  let amount: Decimal;
  try {
    amount = baseAmount(request.quantity, request.unit, item.unit);
  } catch (error) {
    if (error instanceof QuantityError) throw refused('bad-quantity', 'quantity', error.message);
    throw error;
  }
  const unitCost = decimalOf(request.unitCost, 'unitCost', 'unit cost');
  const judgement = judge(request, item);
  const refuse = request.decision === 'refuse';
  if (refuse) {
    // Turned away within its limit: the reason is the cook's note.
    if (judgement.within && !request.note?.trim())
      throw refused('note-needed', 'note', 'say why the delivery is refused');
  } else {
    if (useBy && useBy < receivedOn)
      throw refused(
        'past-use-by',
        'useBy',
        `its use-by, ${dayWords(useBy)}, has passed: refuse the delivery`,
      );
    if (!judgement.within && request.decision === undefined)
      throw refused(
        'decision-needed',
        'decision',
        `${judgement.words}: refuse it, or take it in and say what was done`,
        { limit: judgement.limit.words, source: judgement.limit.source, found: judgement.words },
      );
    if (!judgement.within && !request.action)
      throw refused(
        'action-needed',
        'action',
        `${judgement.words}: to take it in, say the cause, how it is under control again, what keeps it from happening again and what was done with the product`,
      );
    if (judgement.within && request.action)
      throw refused('no-deviation', 'action', `${judgement.words}: there is nothing to correct`);
  }
  return {
    item,
    itemName: itemWords(item),
    establishment,
    quantity: new Decimal(request.quantity.trim()).toString(),
    amount: amount.toString(),
    unitCost,
    judgement,
    decision: refuse ? 'refused' : judgement.within ? 'accepted' : 'accepted-with-action',
  };
}
