import { existsSync, readFileSync } from 'node:fs';
import { siteOf } from '../auth/request-person.ts';
import path from 'node:path';
import type { Request, RequestHandler } from 'express';
import type { AppContext } from '../app-context.ts';
import { AppError, badRequest, conflict } from '../http/app-error.ts';
import { labelPdf } from '../records/records.ts';
import { serverToday } from '../server-today.ts';
import { CATALOGUE_FILE } from '../../shared/catalogue/catalogue-file.ts';
import type { Catalogue } from '../../shared/catalogue/catalogue-types.ts';
import { readCatalogue } from '../../shared/catalogue/read-catalogue.ts';
import { isIsoDate } from '../../shared/calculation/dates.ts';
import { isLabelSize, labelSizeRefusal, type LabelSize } from '../../shared/labels/label-sizes.ts';
import { dec, type Decimal } from '../../shared/decimal.ts';
import { netWeight } from '../../shared/labels/net-weight.ts';
import {
  productLabel,
  productLabelView,
  type ProductLabel,
} from '../../shared/labels/product-label.ts';
import { parseMass } from '../../shared/units/mass.ts';
import { QuantityError } from '../../shared/units/quantity-error.ts';
import { sendPdf } from '../http/send-pdf.ts';
import type { LabelNotYet } from '../../shared/api/product-label-view.ts';
import { assemblyBatchLabel } from './assembly-batch-label.ts';

/** What a label request asks for, read from its query. */
interface LabelQuery {
  readonly size: LabelSize;
  readonly netGrams?: Decimal;
  readonly packedOn: string;
}

/** One query parameter as text, or undefined; a parameter given twice is refused. */
function one(req: Request, name: string): string | undefined {
  const value = req.query[name];
  if (value === undefined) return undefined;
  if (typeof value !== 'string') throw badRequest(`give ${name} once`);
  return value.trim();
}

/**
 * The size, net weight and packed-on day of a label request, or a refusal in words. Whether the
 * net weight is needed is known once the label is worked out (labelRoute).
 */
function labelQuery(req: Request, today: string): LabelQuery {
  const size = one(req, 'size') || '4x6';
  if (!isLabelSize(size))
    throw badRequest(
      `a label is 4x6 or 2x1 (inches), or a sheet of small labels on letter or a4 paper, not "${size}"`,
    );
  const net = one(req, 'net');
  let netGrams: Decimal | undefined;
  if (net) {
    try {
      netGrams = parseMass(net);
    } catch (error) {
      if (error instanceof QuantityError) throw badRequest(`the net weight: ${error.message}`);
      throw error;
    }
    if (netGrams.isZero()) throw badRequest('the net weight must be more than 0');
  }
  const packedOn = one(req, 'packed') || today;
  if (!isIsoDate(packedOn))
    throw badRequest(`the packed-on day is a date such as 2026-03-02, not "${packedOn}"`);
  return { size, netGrams, packedOn };
}

/** The catalogue beside the formulas when it reads cleanly; without it labels keep formula names. */
function catalogueOf(formulasDir: string): Catalogue | undefined {
  const file = path.join(formulasDir, CATALOGUE_FILE);
  if (!existsSync(file)) return undefined;
  return readCatalogue(readFileSync(file, 'utf8'), CATALOGUE_FILE).catalogue;
}

/** The label of the batch a request names, worked out from its formula and recorded weights. */
async function batchLabel(
  context: AppContext,
  req: Request,
  query: LabelQuery,
): Promise<ProductLabel> {
  const { records, config } = context;
  // The site's batch only; its parts are read through it (assemblyParts), whatever they are.
  const batch = await records.showBatch(String(req.params.lot), siteOf(req));
  if (batch.status === 'planned' || batch.status === 'discarded')
    throw conflict(
      'not-packed',
      `batch ${batch.lotCode} is ${batch.status === 'planned' ? 'planned, not made yet' : 'discarded'}: it has no product to label`,
    );
  const formula = await records.formulaOf(batch);
  if (!formula)
    throw conflict(
      'formula-unavailable',
      `the formula ${batch.formula.id} is no longer kept at the revision this batch was calculated from`,
    );
  const facts = {
    catalogue: catalogueOf(config.formulasDir),
    lotCode: batch.lotCode,
    packedOn: query.packedOn,
    netGrams: query.netGrams,
    kitchen: { name: config.kitchenName, address: config.kitchenAddress ?? undefined },
  };
  if (formula.kind === 'assembly') return assemblyBatchLabel(context, formula, facts);
  return productLabel({ formula, result: batch.result, ...facts });
}

/**
 * GET /api/batches/:lot/label.pdf?size=4x6|2x1|letter|a4&net=MASS&packed=YYYY-MM-DD: a product
 * label for a recorded batch, packed today unless another day is given; letter and a4 are sheets
 * of the 2 × 1 lot and date sticker. A batch not made yet, or thrown away, has no label; a small label for a
 * product that must carry the safe handling instructions is refused with 422
 * too-small-for-safe-handling, and a 4 × 6 label or a lot and date sticker whose words do not
 * fit at the least lettering allowed with 422 label-too-full.
 */
export function labelRoute(context: AppContext): RequestHandler {
  return async (req, res) => {
    const query = labelQuery(req, serverToday(context));
    const label = await batchLabel(context, req, query);
    const refusal = labelSizeRefusal(query.size, label.safeHandling.required);
    if (refusal) throw new AppError(422, 'too-small-for-safe-handling', refusal);
    if (query.size === '4x6' && !label.net)
      throw badRequest(
        `a 4 × 6 label declares the net weight of the package: give it as net, such as 340 g or 12 oz${label.netNote ? ` (${label.netNote})` : ''}`,
      );
    const pdf = await labelPdf(label, query.size).catch((error: unknown) => {
      if (tooFull(error)) throw new AppError(422, 'label-too-full', error.message);
      throw error;
    });
    sendPdf(res, pdf, `${label.lotCode}-label-${query.size}.pdf`);
  };
}

/** A label whose content does not fit its size (known by name: the PDF stack loads lazily). */
function tooFull(error: unknown): error is Error {
  return error instanceof Error && error.name === 'LabelTooFullError';
}

/**
 * Why a label's content does not fit a size, as a sentence, or undefined when it fits: found by
 * laying the label out, as printing it would. A label not yet given its net weight is laid out
 * with one (any weight takes the one line), so that giving it cannot make it too full.
 */
async function refusedAt(label: ProductLabel, size: '4x6' | '2x1'): Promise<string | undefined> {
  try {
    await labelPdf({ ...label, net: label.net ?? netWeight(dec('1000')) }, size);
    return undefined;
  } catch (error) {
    if (!tooFull(error)) throw error;
    return error.message.charAt(0).toUpperCase() + error.message.slice(1);
  }
}

/**
 * GET /api/batches/:lot/label?net=MASS&packed=YYYY-MM-DD: the label's content as it prints, for
 * the console's preview; the net weight is optional here. The 4 × 6 label and the lot and date
 * sticker are laid out to say whether their content fits, so the preview never offers a label
 * that would be refused.
 * An assembly whose parts are not recorded yet answers `{ notYet }` with the reason.
 */
export function labelContentRoute(context: AppContext): RequestHandler {
  return async (req, res) => {
    const query = labelQuery(req, serverToday(context));
    let label: ProductLabel;
    try {
      label = await batchLabel(context, req, query);
    } catch (error) {
      // Not a fault of the request: the preview says so, as content, until the parts are recorded.
      if (error instanceof AppError && error.code === 'parts-not-recorded') {
        const notYet: LabelNotYet = { notYet: error.message };
        res.json(notYet);
        return;
      }
      throw error;
    }
    // The sticker is laid out only for a product it may carry (label-sizes.ts).
    const sticker = label.safeHandling.required ? undefined : await refusedAt(label, '2x1');
    res.json(productLabelView(label, await refusedAt(label, '4x6'), sticker));
  };
}
