import { QueryTypes } from 'sequelize';
import type { AppContext } from '../app-context.ts';
import { AppError, conflict } from '../http/app-error.ts';
import { PlanError } from '../../shared/calculation/plan/plan-error.ts';
import { dec } from '../../shared/decimal.ts';
import type { AssemblyFormula } from '../../shared/formula/formula-types.ts';
import {
  AssemblyLabelError,
  assemblyLabel,
  type AssemblyLabelInput,
  type PartBatch,
} from '../../shared/labels/assembly-label.ts';
import type { ProductLabel } from '../../shared/labels/product-label.ts';

/** The batches an assembly batch was made from, by part, and the assemblies among them. */
export interface AssemblyParts {
  readonly parts: Map<string, PartBatch[]>;
  readonly assemblies: Map<string, AssemblyFormula>;
}

/** The source batches of a batch's standing lot uses, oldest first, with what went in. */
function sourcesOf(context: AppContext, lot: string) {
  return context.db.sequelize.query<{ lot_code: string; amount: string }>(
    `SELECT s.lot_code, u.amount FROM lot_uses u
     JOIN batches b ON b.id = u.batch_id
     JOIN batches s ON s.id = u.source_batch_id
     WHERE b.lot_code = ? AND u.replaced_at IS NULL ORDER BY u.id`,
    { replacements: [lot], type: QueryTypes.SELECT },
  );
}

/**
 * The batches an assembly batch's parts were made from, as its label needs them: each with its
 * formula at the revision it was calculated from, its recorded result, the grams that went in and
 * the day it was made (a cure's, the day it came out of its hold). A part that is itself an
 * assembly batch is followed down to the batches it was made from (lot uses never close a loop;
 * each is followed once all the same).
 * @throws AppError 409 formula-unavailable when a part's formula is no longer kept at its revision
 */
export async function assemblyParts(context: AppContext, lot: string): Promise<AssemblyParts> {
  const found: AssemblyParts = { parts: new Map(), assemblies: new Map() };
  const walked = new Set<string>([lot]);
  const walk = async (code: string): Promise<void> => {
    for (const use of await sourcesOf(context, code)) {
      const batch = await context.records.showBatch(use.lot_code);
      const formula = await context.records.formulaOf(batch);
      if (!formula)
        throw conflict(
          'formula-unavailable',
          `the formula ${batch.formula.id} is no longer kept at the revision batch ${batch.lotCode}, a part of this one, was calculated from`,
        );
      if (formula.kind === 'assembly') {
        found.assemblies.set(formula.id, formula);
        if (!walked.has(batch.lotCode)) {
          walked.add(batch.lotCode);
          await walk(batch.lotCode);
        }
        continue;
      }
      const list = found.parts.get(formula.id) ?? [];
      list.push({
        formula,
        result: batch.result,
        grams: dec(use.amount),
        madeOn: batch.readyOn ?? batch.startedOn,
      });
      found.parts.set(formula.id, list);
    }
  };
  await walk(lot);
  return found;
}

/**
 * The label of an assembly batch, from the batches its parts were made from; refused with 409
 * parts-not-recorded until every part's batch is recorded, and with 422 and the plan's reason
 * when the assembly cannot be worked through at its parts' revisions.
 */
export async function assemblyBatchLabel(
  context: AppContext,
  assembly: AssemblyFormula,
  facts: Omit<AssemblyLabelInput, 'assembly' | 'parts'>,
): Promise<ProductLabel> {
  const { parts, assemblies } = await assemblyParts(context, facts.lotCode);
  const titles = new Map(
    (await context.formulas.files()).flatMap(({ reading: { formula } }) =>
      formula ? [[formula.id, formula.title] as const] : [],
    ),
  );
  try {
    return assemblyLabel({ ...facts, assembly, assemblies, parts, titles });
  } catch (error) {
    if (error instanceof AssemblyLabelError) throw conflict('parts-not-recorded', error.message);
    if (error instanceof PlanError) throw new AppError(422, error.reason, error.message);
    throw error;
  }
}
