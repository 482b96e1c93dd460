import type { Transaction } from 'sequelize';
import { addDays, type RawBatchOptions, type UnitSystem } from '../../shared/index.ts';
import type { AppContext } from '../app-context.ts';
import type { BatchStatus } from '../../shared/api/batch-record.ts';
import type { BatchActor, ChangeOptions } from '../batches/batch.ts';
import { prepareBatch } from '../batches/prepare-batch.ts';
import type { CurrentFormula } from '../formulas/formula-store.ts';
import { AppError } from '../http/app-error.ts';
import type { SiteScope } from '../sites/site-scope.ts';
import { seedTurns } from './seed-turns.ts';

/** One batch of the invented kitchen's recent weeks: which formula, which day, how big. */
export interface DemoBatch {
  readonly formula: string;
  /** Start day, counted from today (negative: days ago). */
  readonly day: number;
  readonly batch: RawBatchOptions;
  readonly units?: UnitSystem;
  readonly notes?: string;
  /** Thrown away: on which day after the start, and why. */
  readonly discard?: { readonly after: number; readonly reason: string };
}

/** Grams as batch option text, varied by a batch's index without any randomness. */
function grams(base: number, index: number, spread: number): string {
  return `${base + ((index * 137) % spread)} g`;
}

/**
 * About five weeks of the Quillmoor Smokehouse (an invented kitchen): bacon every week, maple
 * belly, hams, brisket, hot links, buns, burger grind, sauce and rub, ending with two batches
 * planned for the coming days.
 */
function demoBatches(): DemoBatch[] {
  const batches: DemoBatch[] = [];
  const add = (formula: string, days: readonly number[], make: (i: number) => RawBatchOptions) =>
    days.forEach((day) => batches.push({ formula, day, batch: make(batches.length) }));
  add('quillmoor-belly', [-35, -28, -21, -14, -9, -7], (i) => ({
    meat: grams(3800, i, 900),
    // 3.5–4.5 cm bellies: 7–9 days at the formula's 2 days per cm.
    thickness: `${35 + (i % 3) * 5} mm`,
  }));
  add('maple-pump-belly', [-33, -26, -19, -12, -5, -1], (i) => {
    // Whole tens of grams, so a tenth is exact: the formula's 10 % pump, 120 ppm, exactly the
    // ceiling for pumped bacon (never a float: 4610 × 1.1 is not 5071 in binary).
    const meat = 4600 + ((i * 210) % 800);
    return { meat: `${meat} g`, pumpedWeight: `${meat + meat / 10} g` };
  });
  add('ham-pump', [-30, -16, -3], (i) => ({
    meat: grams(6000, i, 700),
    largestPiece: grams(2900, i, 500),
    pumpedWeight: grams(6750, i, 700),
  }));
  add('brisket-brine', [-32, -18, -6], (i) => ({
    meat: grams(7600, i, 900),
    thickness: `${45 + (i % 2) * 5} mm`,
  }));
  add('hot-link-cure', [-34, -27, -20, -13, -6, -2], (i) => ({ meat: grams(10500, i, 3000) }));
  add('pit-bun', [-35, -31, -28, -24, -21, -17, -14, -10, -7, -3, 0, 1], (i) => ({
    pieces: String(48 + (i % 3) * 12),
    room: `${21 + (i % 3)}C`,
    flourTemp: '20C',
    prefermentTemp: '19C',
    tap: '16C',
  }));
  add('chuck-grind', [-34, -27, -20, -13, -6, 0, 2], (i) => ({
    total: grams(18000, i, 6000),
  }));
  add('house-sauce', [-33, -26, -19, -12, -5], (i) => ({ total: grams(2000, i, 2000) }));
  add('brisket-rub', [-30, -15, -2], (i) => ({ base: grams(1000, i, 1000) }));

  // A few that tell their own story.
  batches.push({
    formula: 'quillmoor-belly',
    day: -24,
    batch: { meat: '9 lb 6 oz', thickness: '1.5in' },
    units: 'us',
    notes: 'Bellies from the Friday delivery, weighed on the floor scale in pounds.',
  });
  batches.push({
    formula: 'maple-pump-belly',
    day: -8,
    // Re-injected to the full 10 % pump: at 9.4 % it would carry 517 ppm erythorbate, short of the
    // 550 ppm pumped bacon must carry (9 CFR 424.22(b)), and be refused.
    batch: { meat: '5 kg', pumpedWeight: '5.5 kg' },
    notes: 'Injector needle clogged halfway; cleared it and re-injected to the target weight.',
  });
  const discarded = batches.find((b) => b.formula === 'brisket-brine' && b.day === -18);
  if (discarded)
    Object.assign(discarded, {
      discard: {
        after: 3,
        reason:
          'Walk-in read 9 °C at the morning check (door seal failed overnight); the brine left 2–4 °C, so the flats were discarded as the HACCP plan says.',
      },
    });
  return batches.sort((a, b) => a.day - b.day);
}

/** The demo people who make (tobin, and rosa one batch in four), and review, the batches. */
export interface Crew {
  readonly tobin: BatchActor;
  readonly rosa: BatchActor;
  readonly imke: BatchActor;
}

/** An ISO timestamp `minutes` after midnight UTC of a day counted from today. */
function stamp(today: string, day: number, minutes: number): string {
  return new Date(Date.parse(`${addDays(today, day)}T00:00:00Z`) + minutes * 60_000).toISOString();
}

/**
 * What happens to a batch after it is recorded: [status, day, minutes] steps (minutes after
 * midnight UTC, or for today minutes before now), then perhaps a reviewer's sign-off.
 */
function story(
  demo: DemoBatch,
  kind: string,
  readyDay: number | undefined,
  index: number,
): { steps: [BatchStatus, number, number][]; signOffDay?: number } {
  const { day } = demo;
  if (day > 0) return { steps: [] };
  if (demo.discard)
    return {
      steps: [
        ['curing', day, 8 * 60 + 40],
        ['discarded', day + demo.discard.after, 7 * 60 + 15],
      ],
    };
  if (kind === 'cure') {
    const ready = readyDay ?? day + 1;
    const curing: [BatchStatus, number, number] = ['curing', day, 8 * 60 + 30 + (index % 5) * 7];
    // Still curing when its ready day is yesterday or later: yesterday's is overdue.
    if (ready >= -1) return { steps: [curing] };
    return {
      steps: [curing, ['done', ready, 9 * 60 + (index % 4) * 10]],
      ...(ready <= -3 ? { signOffDay: ready + 1 } : {}),
    };
  }
  if (day === 0) return { steps: kind === 'dough' ? [['proofing', 0, -60]] : [] };
  const made: [BatchStatus, number, number][] =
    kind === 'dough'
      ? [
          ['proofing', day, 7 * 60 + 20],
          ['done', day, 9 * 60 + 45],
        ]
      : [['done', day, 10 * 60 + (index % 6) * 5]];
  return { steps: made, ...(day <= -2 && index % 2 === 0 ? { signOffDay: day + 1 } : {}) };
}

/**
 * The formulas the demo batches use, as they are now, read in one pass over the folder (as
 * FormulaStore.current reads them); a missing or invalid one is skipped.
 */
async function demoFormulas(
  context: AppContext,
  ids: readonly string[],
): Promise<Map<string, CurrentFormula>> {
  const found = new Map<string, CurrentFormula>();
  let files;
  try {
    files = await context.formulas.files();
  } catch (error) {
    // No readable formulas folder: the demo starts with people and no batches.
    if (error instanceof AppError) return found;
    throw error;
  }
  for (const file of files) {
    const formula = file.reading.formula;
    if (formula && ids.includes(formula.id) && !found.has(formula.id))
      found.set(formula.id, { formula, revision: file.revision, file });
  }
  return found;
}

const SIGN_OFF_NOTES = [
  'Batch card, scale print-out and cure weights checked against the sheet.',
  'Checked the cooler log for the whole hold: 2–4 °C throughout.',
  'Verified the weights and the ppm on the record.',
];

/**
 * Records about five weeks of demo batches through the same calculation path as the API (so
 * every stored result is real), with their status changes and sign-offs at plausible times.
 * Deterministic for a given day. The history is written without audit entries: it is the demo's
 * starting state, not something anyone did.
 */
export async function seedBatches(context: AppContext, now = new Date()): Promise<number> {
  const [tobin, rosa, imke] = await Promise.all(
    ['tobin', 'rosa', 'imke'].map((name) => context.people.findByUsername(name)),
  );
  if (!tobin || !rosa || !imke) return 0;
  return (await seedBatchPlan(context, demoBatches(), { tobin, rosa, imke }, { now })).length;
}

/**
 * Records a plan of demo batches in one write, made by the crew at a site (none: the first),
 * through the same calculation path, story and sign-offs as the smokehouse's own.
 * @returns their lot codes in the plan's order (a formula missing from the folder is skipped)
 */
export async function seedBatchPlan(
  context: AppContext,
  plan: readonly DemoBatch[],
  crew: Crew,
  { now, site }: { now: Date; site?: SiteScope },
): Promise<string[]> {
  const today = now.toISOString().slice(0, 10);
  const formulas = await demoFormulas(
    context,
    plan.map((b) => b.formula),
  );
  const lots: string[] = [];
  await context.db.write(async (transaction) => {
    for (const [index, demo] of plan.entries()) {
      const current = formulas.get(demo.formula);
      if (!current) continue;
      lots.push(
        await seedOne(context, transaction, crew, { demo, current, index, today, now, site }),
      );
    }
  });
  return lots;
}

async function seedOne(
  context: AppContext,
  transaction: Transaction,
  crew: Crew,
  where: {
    demo: DemoBatch;
    current: CurrentFormula;
    index: number;
    today: string;
    now: Date;
    site: SiteScope | undefined;
  },
): Promise<string> {
  const { demo, current, index, today, now, site } = where;
  const operator = index % 4 === 3 ? crew.rosa : crew.tobin;
  const start = addDays(today, demo.day);
  const prepared = prepareBatch(
    current,
    {
      formula: demo.formula,
      batch: { start, ...demo.batch },
      status: demo.day > 0 ? 'planned' : 'in-progress',
      ...(demo.units ? { units: demo.units } : {}),
      ...(demo.notes ? { notes: demo.notes } : {}),
    },
    operator.id,
    today,
  );
  // Today's work happened in the hours before now; planned batches were entered the day before.
  const at = (day: number, minutes: number): string =>
    day === 0
      ? new Date(now.getTime() + minutes * 60_000).toISOString()
      : stamp(today, day, minutes);
  const recordedAt =
    demo.day > 0
      ? stamp(today, -1, 15 * 60 + index)
      : at(demo.day, demo.day === 0 ? -180 : 7 * 60 + 10 + ((index * 7) % 50));
  const by = (actor: BatchActor, when: string): ChangeOptions => ({
    actor,
    at: when,
    audit: false,
    ...(site ? { site } : {}),
  });
  const lot = await context.batches.writes.insert(transaction, prepared, by(operator, recordedAt));
  const readyDay = prepared.readyOn
    ? Math.round((Date.parse(prepared.readyOn) - Date.parse(today)) / 86_400_000)
    : undefined;
  const { steps, signOffDay } = story(demo, current.formula.kind, readyDay, index);
  for (const [status, day, minutes] of steps) {
    const reason = status === 'discarded' ? (demo.discard?.reason ?? null) : null;
    await context.batches.writes.move(
      transaction,
      lot,
      status,
      reason,
      by(operator, at(day, minutes)),
    );
  }
  if (steps.at(-1)?.[0] === 'curing')
    await seedTurns(context, transaction, {
      lot,
      result: prepared.result,
      index,
      today,
      now,
      by: operator,
    });
  // A batch that failed a check waits for the reviewer to look at it in person. Imke signs off
  // and never records, so the demo holds to separation of duties; every sign-off comes after
  // the last move, and every cure cures before it is done, as the workflow rules ask.
  if (signOffDay !== undefined && prepared.checksPassed)
    await context.batches.writes.signOff(
      transaction,
      lot,
      SIGN_OFF_NOTES[index % SIGN_OFF_NOTES.length],
      by(crew.imke, stamp(today, signOffDay, 14 * 60 + (index % 6) * 9)),
    );
  return lot;
}
