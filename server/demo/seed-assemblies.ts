import { QueryTypes } from 'sequelize';
import { addDays } from '../../shared/calculation/dates.ts';
import type { LotPick } from '../../shared/api/batch-lots.ts';
import { partNeeds } from '../../shared/stock/lot-suggestions.ts';
import type { AppContext } from '../app-context.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import { prepareBatch } from '../batches/prepare-batch.ts';
import { FormulaHistory } from '../formulas/formula-history.ts';
import { AppError } from '../http/app-error.ts';
import type { LotUsesDeps } from '../lot-uses/batch-lots.ts';
import { recordLotUses } from '../lot-uses/record-lot-uses.ts';

/** A finished demo batch an assembly may be made from. */
interface Made {
  readonly lot_code: string;
  readonly formula_id: string;
  readonly started_on: string;
  readonly ready_on: string | null;
}

/** One demo assembly batch: which, on which day, how many, from which batches of its parts. */
interface DemoAssembly {
  readonly formula: string;
  readonly day: string;
  readonly count: number;
  /** The batch each part is drawn from, by the part's formula id. */
  readonly from: ReadonlyMap<string, string>;
}

/** Packs of sliced bacon from each finished belly, and burgers on each day a grind was made. */
const PACKS = 12;
const BURGERS = 40;

/**
 * The bacon's days off the cure before it is sliced: rinsed and dried, then cold-smoked and
 * chilled (formulas/quillmoor-belly.yaml, lead_days: 2).
 */
const SMOKE_DAYS = 2;

/** The latest finished batch of a formula ready for use on a day, if any. */
function latest(made: readonly Made[], formula: string, day: string): Made | undefined {
  return made
    .filter((b) => b.formula_id === formula && readyFor(b) <= day)
    .sort((a, b) => readyFor(b).localeCompare(readyFor(a)) || b.lot_code.localeCompare(a.lot_code))
    .at(0);
}

/** The day a batch can go into another: a belly once cured and smoked, the rest on their day. */
function readyFor(batch: Made): string {
  if (batch.formula_id === 'quillmoor-belly')
    return addDays(batch.ready_on ?? batch.started_on, SMOKE_DAYS);
  return batch.ready_on ?? batch.started_on;
}

/**
 * The demo's packs and burgers, drawn from its finished batches: a dozen packs of sliced bacon two
 * days after each belly comes off the cure (smoked and chilled), and forty burgers on each day a
 * grind was made, from that grind and the latest bun, bacon and sauce ready by then. Up to
 * yesterday: today's service is still to be made.
 */
function demoAssemblies(made: readonly Made[], today: string): DemoAssembly[] {
  const yesterday = addDays(today, -1);
  const assemblies: DemoAssembly[] = [];
  for (const belly of made.filter((b) => b.formula_id === 'quillmoor-belly')) {
    const day = readyFor(belly);
    if (day <= yesterday)
      assemblies.push({
        formula: 'bacon-pack',
        day,
        count: PACKS,
        from: new Map([['quillmoor-belly', belly.lot_code]]),
      });
  }
  for (const grind of made.filter((b) => b.formula_id === 'chuck-grind')) {
    const day = grind.started_on;
    if (day > yesterday) continue;
    const from = new Map([['chuck-grind', grind.lot_code]]);
    for (const part of ['pit-bun', 'quillmoor-belly', 'house-sauce']) {
      const batch = latest(made, part, day);
      if (batch) from.set(part, batch.lot_code);
    }
    assemblies.push({ formula: 'smokehouse-burger', day, count: BURGERS, from });
  }
  return assemblies.sort((a, b) => a.day.localeCompare(b.day));
}

/**
 * Records the demo kitchen's packs of sliced bacon and its burgers through the API's calculation
 * path, each made (done) on its day by Tobin, with the batches of its parts as its "Made from":
 * so a pack traces back to its belly batch and on to the belly's lot and the cure's. History:
 * no audit entries. Call it after the demo batches have their lots (seedDemoLotUses), so those
 * draw first to expire first and these draw on the batches named here.
 * @returns how many assembly batches were recorded
 */
export async function seedAssemblies(context: AppContext, now = new Date()): Promise<number> {
  const today = now.toISOString().slice(0, 10);
  const tobin = await context.people.findByUsername('tobin');
  if (!tobin) return 0;
  const history = new FormulaHistory(context.formulas, context.db, context.audit);
  let library;
  try {
    library = await history.library();
  } catch (error) {
    // No readable formulas folder: the demo has no batches to make assemblies from.
    if (error instanceof AppError) return 0;
    throw error;
  }
  const made = await context.db.sequelize.query<Made>(
    `SELECT lot_code, formula_id, started_on, ready_on FROM batches
     WHERE status = 'done' AND kind <> 'assembly' ORDER BY started_on, id`,
    { type: QueryTypes.SELECT },
  );
  const deps: LotUsesDeps = { ...context, history, folder: context.formulas.folder };
  let count = 0;
  for (const [index, demo] of demoAssemblies(made, today).entries()) {
    const formula = library.get(demo.formula);
    if (!formula) continue;
    const current = await history.current(demo.formula);
    const prepared = prepareBatch(
      current,
      { formula: demo.formula, batch: { count: String(demo.count), start: demo.day } },
      tobin.id,
      today,
      library,
    );
    const by = (minutes: number): ChangeOptions => ({
      actor: tobin,
      at: new Date(Date.parse(`${demo.day}T00:00:00Z`) + minutes * 60_000).toISOString(),
      audit: false,
    });
    // Packed mid-morning; burgers for lunch.
    const minutes = (demo.formula === 'bacon-pack' ? 10 * 60 : 11 * 60) + (index % 5) * 7;
    const lot = await context.db.write((t) =>
      context.batches.writes.insert(t, prepared, by(minutes)),
    );
    const needs = partNeeds(prepared.result);
    const picks: LotPick[] = [...demo.from].flatMap(([part, batch]) => {
      const need = needs.get(part);
      return need ? [{ part, batch, amount: `${need.toString()} g` }] : [];
    });
    if (picks.length) await recordLotUses(deps, lot, { picks }, by(minutes + 5));
    count++;
  }
  return count;
}
