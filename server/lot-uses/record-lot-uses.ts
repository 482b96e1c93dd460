import { QueryTypes, type Transaction } from 'sequelize';
import type { BatchLots, LotPick, LotUsesRequest } from '../../shared/api/batch-lots.ts';
import { Decimal } from '../../shared/decimal.ts';
import { lotAmountWords } from '../../shared/presentation/lot-amount-words.ts';
import { dayWords } from '../../shared/presentation/date-words.ts';
import { parseBaseAmount } from '../../shared/stock/base-measure.ts';
import { QuantityError } from '../../shared/units/quantity-error.ts';
import { appendChange } from '../audit/append-change.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import { insertRow } from '../db/insert-row.ts';
import { AppError, conflict } from '../http/app-error.ts';
import { recordedBatch, type RecordedBatch } from '../process/recorded-batch.ts';
import { formulaOf } from '../process/weighing-writes.ts';
import { batchLots, needsOf, suggestionFor, type LotUsesDeps, type NeedsOf } from './batch-lots.ts';
import { drawsOn, receiptByCode, standingUses } from './lot-use-rows.ts';
import { datedSourcesById } from './source-use-bys.ts';
import { isAtOtherSite } from '../sites/site-guards.ts';

/** A lot use about to be written. */
interface NewUse {
  readonly item: string;
  readonly amount: Decimal;
  readonly receipt?: { readonly id: number; readonly code: string };
  readonly source?: { readonly id: number; readonly code: string };
}

/** " at KITCHEN" on a group's install, where a lot of another site is not this batch's to use. */
const here = ({ site }: LotUsesDeps): string => (site?.filters ? ` at ${site.name}` : '');

/** A pick that cannot be recorded: 422 with a stable code, naming the pick at fault. */
function refused(code: string, field: string, message: string): AppError {
  // The words alone, as a cook reads them; the field is in the details.
  return new AppError(422, code, message, [{ field, message }]);
}

/**
 * Records the lots a batch used on its day of use, in one write with its audit entry: the
 * suggestion accepted as it stands, or the cook's picks. Each received lot's remaining is
 * decremented (emptied on the day of use when it reaches nothing). Recording again is refused
 * unless `replace`: then the earlier uses are marked replaced and what they took is given back
 * first. Answers with the batch's lots as they now stand.
 * @throws RecordsError 'not-found'; AppError 409 'not-started', 'lots-recorded'; 422 naming the
 *   pick: 'bad-lots', 'bad-amount', 'no-such-lot', 'other-item', 'not-needed', 'refused-lot',
 *   'not-on-hand', 'not-yet-received', 'expired-lot', 'over-draw', 'no-such-batch', 'not-a-part',
 *   'discarded-source', 'self-source', 'source-later', 'expired-source', 'cycle',
 *   'nothing-to-record'
 */
export async function recordLotUses(
  deps: LotUsesDeps,
  lot: string,
  request: LotUsesRequest,
  by: ChangeOptions,
): Promise<BatchLots> {
  if (Boolean(request.accept) === Boolean(request.picks))
    throw refused(
      'bad-lots',
      '(body)',
      'either accept the suggested lots or give the lots used, not both',
    );
  const at = by.at ?? new Date().toISOString();
  const seen = await recordedBatch(deps.db, lot);
  const formula = await formulaOf(deps.history, seen);
  await deps.db.write(async (t) => {
    const batch = await recordedBatch(deps.db, lot, t);
    if (batch.status === 'planned')
      throw conflict(
        'not-started',
        `batch ${batch.lotCode} is planned: record the lots it used once it is started`,
      );
    const earlier = await standingUses(deps.db, batch.id, t);
    if (earlier.length && !request.replace)
      throw conflict(
        'lots-recorded',
        `the lots batch ${batch.lotCode} used are recorded already; to record them again, replace them`,
      );
    for (const use of earlier) {
      if (use.receipt_id !== null) await giveBack(deps, t, use.receipt_id, use.amount);
    }
    if (earlier.length)
      await deps.db.sequelize.query(
        'UPDATE lot_uses SET replaced_at = ?, replaced_by = ? WHERE batch_id = ? AND replaced_at IS NULL',
        { replacements: [at, by.actor.id, batch.id], transaction: t },
      );
    const of = await needsOf(deps, batch, formula, t);
    const uses = request.accept
      ? await accepted(deps, t, batch, of)
      : await picked(deps, t, batch, of, request.picks ?? []);
    for (const use of uses) await write(deps, t, batch, use);
    await appendChange(deps.audit, t, by, 'batch-lots', batch.lotCode, {
      usedOn: batch.startedOn,
      ...(request.accept ? { accepted: true } : {}),
      ...(earlier.length ? { replaced: earlier.map((use) => use.id) } : {}),
      uses: uses.map((use) => ({
        item: use.item,
        lot: (use.receipt ?? use.source)!.code,
        amount: use.amount.toString(),
      })),
    });
  });
  return batchLots(deps, lot);
}

/** What is left of a received lot, read in the write. */
async function lotLeft(deps: LotUsesDeps, t: Transaction, id: number) {
  const [row] = await deps.db.sequelize.query<{ remaining: string; emptied_on: string | null }>(
    'SELECT remaining, emptied_on FROM receipts WHERE id = ?',
    { replacements: [id], type: QueryTypes.SELECT, transaction: t },
  );
  return row;
}

/** What an earlier use took, given back to its lot; a lot it had emptied is on hand again. */
async function giveBack(deps: LotUsesDeps, t: Transaction, id: number, amount: string) {
  const row = await lotLeft(deps, t, id);
  const was = new Decimal(row.remaining);
  // Emptied by use (nothing left), not thrown away with something left: on hand again.
  const emptied = was.isZero() ? null : row.emptied_on;
  await deps.db.sequelize.query('UPDATE receipts SET remaining = ?, emptied_on = ? WHERE id = ?', {
    replacements: [was.plus(amount).toString(), emptied, id],
    transaction: t,
  });
}

/** The suggestion as it stands, read inside the write. */
async function accepted(
  deps: LotUsesDeps,
  t: Transaction,
  batch: RecordedBatch,
  of: NeedsOf,
): Promise<NewUse[]> {
  const suggestion = await suggestionFor(deps, batch, of, t);
  const uses = suggestion.flatMap((item) => item.takes);
  if (uses.length === 0)
    throw refused(
      'nothing-to-record',
      'accept',
      'no lot on hand is suggested for this batch: receive the lots, or pick them',
    );
  const picks = uses.map((use): LotPick =>
    use.source === 'batch'
      ? { part: use.item, batch: use.lotCode, amount: use.amount }
      : { item: use.item, lot: use.lotCode, amount: use.amount },
  );
  return picked(deps, t, batch, of, picks, true);
}

/** The picks checked one by one against the lots and the batch. */
async function picked(
  deps: LotUsesDeps,
  t: Transaction,
  batch: RecordedBatch,
  of: NeedsOf,
  picks: readonly LotPick[],
  baseAmounts = false,
): Promise<NewUse[]> {
  const taken = new Map<number, Decimal>();
  const uses: NewUse[] = [];
  for (const [i, pick] of picks.entries()) {
    const field = `picks.${i}`;
    if ('part' in pick) {
      uses.push(await sourcePick(deps, t, batch, of, pick, field, baseAmounts));
      continue;
    }
    const need = of.needs.items.find((n) => n.item === pick.item);
    if (!need)
      throw refused('not-needed', `${field}.item`, `no line of this batch uses ${pick.item}`);
    // Another site's lot is answered as one that does not exist: a kitchen uses what it
    // received, and a cook at one shop is not told what another shop holds.
    const row = await receiptByCode(deps.db, pick.lot, t, deps.site);
    if (!row)
      throw refused(
        'no-such-lot',
        `${field}.lot`,
        `there is no received lot ${pick.lot}${here(deps)}`,
      );
    const lot = row.lot_code;
    if (row.item !== need.item)
      throw refused(
        'other-item',
        `${field}.lot`,
        `lot ${lot} is ${row.item_name}, not ${need.name}`,
      );
    if (row.decision === 'refused')
      throw refused('refused-lot', `${field}.lot`, `lot ${lot} was refused at the door`);
    if (row.received_on > batch.startedOn)
      throw refused(
        'not-yet-received',
        `${field}.lot`,
        `lot ${lot} came in on ${dayWords(row.received_on)}, after this batch was started on ${dayWords(batch.startedOn)}`,
      );
    if (row.use_by !== null && row.use_by < batch.startedOn)
      throw refused(
        'expired-lot',
        `${field}.lot`,
        `lot ${lot} was to be used by ${dayWords(row.use_by)}, before this batch was started on ${dayWords(batch.startedOn)}: discard it`,
      );
    const amount = baseAmounts ? new Decimal(pick.amount) : amountOf(pick.amount, need, field);
    const left = new Decimal(row.remaining).minus(taken.get(row.id) ?? 0);
    if (row.emptied_on !== null || left.isZero())
      throw refused('not-on-hand', `${field}.lot`, `nothing is left of lot ${lot}`);
    if (amount.greaterThan(left))
      throw refused(
        'over-draw',
        `${field}.amount`,
        `only ${lotAmountWords(left, need.measure, need.unit)} is left of lot ${lot}, not ${lotAmountWords(amount, need.measure, need.unit)}`,
      );
    taken.set(row.id, (taken.get(row.id) ?? new Decimal(0)).plus(amount));
    uses.push({ item: need.item, amount, receipt: { id: row.id, code: lot } });
  }
  return uses;
}

function amountOf(text: string, need: NeedsOf['needs']['items'][number], field: string): Decimal {
  try {
    return parseBaseAmount(text, need.unit);
  } catch (error) {
    if (error instanceof QuantityError)
      throw refused('bad-amount', `${field}.amount`, error.message);
    throw error;
  }
}

/** An earlier batch picked as an assembly's part; its amount in grams as typed, or exact. */
async function sourcePick(
  deps: LotUsesDeps,
  t: Transaction,
  batch: RecordedBatch,
  of: NeedsOf,
  pick: Extract<LotPick, { part: string }>,
  field: string,
  baseAmount: boolean,
): Promise<NewUse> {
  if (!of.parts.includes(pick.part))
    throw refused('not-a-part', `${field}.part`, `${pick.part} is not a part of this batch`);
  let source: RecordedBatch;
  try {
    source = await recordedBatch(deps.db, pick.batch, t);
    if (await isAtOtherSite(deps.db, 'batch', source.lotCode, deps.site))
      throw new Error('elsewhere');
  } catch {
    throw refused(
      'no-such-batch',
      `${field}.batch`,
      `there is no batch ${pick.batch.toUpperCase()}${here(deps)}`,
    );
  }
  const code = source.lotCode;
  const drawn = { id: source.id, code };
  if (source.id === batch.id)
    throw refused('self-source', `${field}.batch`, `batch ${code} cannot be made from itself`);
  if (source.formulaId !== pick.part)
    throw refused('not-a-part', `${field}.batch`, `batch ${code} is not a batch of ${pick.part}`);
  if (source.status === 'discarded')
    throw refused('discarded-source', `${field}.batch`, `batch ${code} was discarded`);
  if (source.startedOn > batch.startedOn)
    throw refused(
      'source-later',
      `${field}.batch`,
      `batch ${code} was started on ${dayWords(source.startedOn)}, after this one`,
    );
  const useBy = (await datedSourcesById(deps.db, deps.history, [source.id], t)).get(
    source.id,
  )?.useBy;
  if (useBy !== undefined && useBy < batch.startedOn)
    throw refused(
      'expired-source',
      `${field}.batch`,
      `batch ${code} was to be used by ${dayWords(useBy)}, before this batch was started on ${dayWords(batch.startedOn)}: discard it`,
    );
  if (await drawsOn(deps.db, source.id, batch.id, t))
    throw refused(
      'cycle',
      `${field}.batch`,
      `batch ${code} is made from this batch already: it cannot go into it as well`,
    );
  if (baseAmount) return { item: pick.part, amount: new Decimal(pick.amount), source: drawn };
  let amount: Decimal;
  try {
    amount = parseBaseAmount(pick.amount, 'g');
  } catch (error) {
    if (error instanceof QuantityError)
      throw refused('bad-amount', `${field}.amount`, error.message);
    throw error;
  }
  return { item: pick.part, amount, source: drawn };
}

/** One lot use written, and what it took off its lot. */
async function write(deps: LotUsesDeps, t: Transaction, batch: RecordedBatch, use: NewUse) {
  await insertRow(
    deps.db,
    t,
    `INSERT INTO lot_uses (batch_id, receipt_id, source_batch_id, item, amount, used_on)
     VALUES (?, ?, ?, ?, ?, ?)`,
    [
      batch.id,
      use.receipt?.id ?? null,
      use.source?.id ?? null,
      use.item,
      use.amount.toString(),
      batch.startedOn,
    ],
  );
  if (!use.receipt) return;
  const row = await lotLeft(deps, t, use.receipt.id);
  const left = new Decimal(row.remaining).minus(use.amount);
  await deps.db.sequelize.query('UPDATE receipts SET remaining = ?, emptied_on = ? WHERE id = ?', {
    replacements: [left.toString(), left.isZero() ? batch.startedOn : null, use.receipt.id],
    transaction: t,
  });
}
