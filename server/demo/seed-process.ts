import { Decimal } from '../../shared/decimal.ts';
import { addDays, type RawBatchOptions } from '../../shared/index.ts';
import type { ResolvedControl } from '../../shared/process/control-types.ts';
import { parseReadingValue } from '../../shared/process/reading-value.ts';
import type { AppContext } from '../app-context.ts';
import type { BatchActor, ChangeOptions } from '../batches/batch.ts';
import { prepareBatch } from '../batches/prepare-batch.ts';
import { FormulaHistory } from '../formulas/formula-history.ts';
import { recordAction } from '../process/corrective-actions.ts';
import { judgeAndOpen, type ProcessDeps } from '../process/judge-and-open.ts';
import { processDeps } from '../process/process-writes.ts';
import { insertReadings } from '../process/reading-writes.ts';
import { verifyBatch } from '../process/verification.ts';
import { addWeighings } from '../process/weighing-writes.ts';
import { after, demoReadings, type DemoPoint } from './demo-readings.ts';

/** Which chamber reading of the smoke is the demo's one over the limit: the fourth, 90 minutes in. */
const OVER_INDEX = 3;

/** The demo people of the stories. */
export interface Crew {
  readonly tobin: BatchActor;
  readonly imke: BatchActor;
}

/** What the stories work with. */
export interface Seeding {
  readonly context: AppContext;
  readonly history: FormulaHistory;
  readonly deps: ProcessDeps;
  readonly crew: Crew;
  readonly now: Date;
  readonly today: string;
}

/** `minutes` after midnight UTC of a day counted from today. */
function stamp(today: string, day: number, minutes: number): string {
  return after(`${addDays(today, day)}T00:00:00.000Z`, minutes);
}

/** Demo history: at its own time, without audit entries (it is the demo's starting state). */
function by(actor: BatchActor, at: string): ChangeOptions {
  return { actor, at, audit: false };
}

/** Records one demo batch through the API's calculation path; its lot code. */
async function record(
  seeding: Seeding,
  formulaId: string,
  batch: RawBatchOptions,
  status: 'planned' | 'in-progress',
  at: string,
): Promise<string | undefined> {
  const current = await seeding.history.current(formulaId).catch(() => undefined);
  if (!current) return undefined;
  const prepared = prepareBatch(
    current,
    { formula: formulaId, batch, status },
    seeding.crew.tobin.id,
    seeding.today,
  );
  return seeding.context.db.write((t) =>
    seeding.context.batches.writes.insert(t, prepared, by(seeding.crew.tobin, at)),
  );
}

/** Moves a demo batch along, at its own time. */
function move(seeding: Seeding, lot: string, to: 'curing' | 'done', at: string): Promise<void> {
  return seeding.context.db.write((t) =>
    seeding.context.batches.writes.move(t, lot, to, null, by(seeding.crew.tobin, at)),
  );
}

/** Every line of a batch's sheet, weighed a little off the calculation as a real scale reads. */
async function weighLines(seeding: Seeding, lot: string, at: string): Promise<void> {
  const batch = await seeding.context.batches.get(lot);
  const lines = (batch?.result.groups ?? []).flatMap((group) => group.lines);
  await addWeighings(
    { ...seeding.context, history: seeding.history },
    lot,
    {
      lines: lines.map((line, i) => ({
        name: line.name,
        // To the scale's 0.1 g, a tenth over on every other line; curing salt never over (a
        // comminuted cure may be figured at its very limit).
        weight:
          line.role === 'curing-salt'
            ? `${new Decimal(line.grams).toDecimalPlaces(1, Decimal.ROUND_DOWN).toFixed(1)} g`
            : `${new Decimal(line.grams)
                .toDecimalPlaces(1)
                .plus((i % 2) / 10)
                .toFixed(1)} g`,
      })),
    },
    by(seeding.crew.tobin, at),
  );
}

/** One stage weight of a demo batch. */
function weighStage(
  seeding: Seeding,
  lot: string,
  name: 'green' | 'cured' | 'smoked' | 'sliced',
  weight: string,
  at: string,
): Promise<unknown> {
  return addWeighings(
    { ...seeding.context, history: seeding.history },
    lot,
    { stage: { name, weight, at } },
    by(seeding.crew.tobin, at),
  );
}

/**
 * Writes readings at a batch's controls as one write, judged at `judgedAt` (a miss opens its
 * deviation then); returns the deviations opened.
 */
export async function readings(
  seeding: Seeding,
  lot: string,
  points: readonly { control: ResolvedControl; point: DemoPoint }[],
  judgedAt: string,
): Promise<number[]> {
  const { deps } = seeding;
  const batch = await deps.process.batch(lot);
  const controls = await deps.process.controlsOf(batch);
  return deps.db.write(async (t) => {
    await insertReadings(
      deps,
      t,
      batch.id,
      points.map(({ control, point }) => ({
        control: control.id,
        at: point.at,
        value: parseReadingValue(point.value, control.measure).toString(),
        enteredAs: point.value,
        source: 'console',
      })),
      by(seeding.crew.tobin, judgedAt),
    );
    const judged = await judgeAndOpen(
      deps,
      t,
      batch,
      controls,
      judgedAt,
      by(seeding.crew.tobin, judgedAt),
    );
    return judged.opened.map((o) => o.id);
  });
}

/** When a batch's product is worked: its cure (days) and the day it is smoked, cooked, chilled. */
interface Windows {
  /** The cure room's hold: from, and how many minutes. */
  readonly cure?: { readonly from: string; readonly minutes: number };
  /** The smoke's start on the process day. */
  readonly smoke: string;
}

/**
 * Where each control's readings fall: the curing cooler through the cure; a chamber through the
 * smoke (its fourth reading the demo's deviation when `over`); the product's own checks one after
 * another from late in the smoke (a cook, a cool), a cold holding the morning after.
 */
export function dayOfProcess(
  controls: readonly ResolvedControl[],
  windows: Windows,
  { over = false }: { over?: boolean } = {},
): { control: ResolvedControl; point: DemoPoint }[] {
  const points: { control: ResolvedControl; point: DemoPoint }[] = [];
  let product = after(windows.smoke, 200);
  let overDue = over;
  for (const control of controls) {
    const { type } = control.limit;
    let made: DemoPoint[];
    if (control.rule === 'curing-room') {
      if (!windows.cure) continue;
      made = demoReadings(control, windows.cure.from, windows.cure.minutes);
    } else if (control.measure === 'chamber-temperature') {
      const bad = overDue && type !== 'at-least' ? OVER_INDEX : undefined;
      if (bad !== undefined) overDue = false;
      made = demoReadings(control, windows.smoke, 240, bad === undefined ? {} : { over: bad });
    } else {
      // Held cold: the morning after it went into the walk-in.
      const begins = type === 'at-most' ? after(product, 16 * 60) : product;
      made = demoReadings(control, begins, type === 'hold' ? 40 : 24 * 60);
      product = after(made[made.length - 1]?.at ?? product, 20);
    }
    for (const point of made) points.push({ control, point });
  }
  return points.sort((a, b) => a.point.at.localeCompare(b.point.at));
}

/**
 * A smoked belly from the green weight to release: lines and stages weighed, the smoker's and the
 * chill's readings, one chamber reading over its limit closed by a corrective action, done and
 * verified by the reviewer.
 */
async function smokedBelly(seeding: Seeding): Promise<void> {
  const { today, crew } = seeding;
  const lot = await record(
    seeding,
    'quillmoor-belly',
    { meat: '4.31 kg', thickness: '4 cm', start: addDays(today, -12) },
    'in-progress',
    stamp(today, -12, 7 * 60 + 40),
  );
  if (!lot) return;
  await weighStage(seeding, lot, 'green', '4.31 kg', stamp(today, -12, 7 * 60 + 45));
  await weighLines(seeding, lot, stamp(today, -12, 7 * 60 + 55));
  await move(seeding, lot, 'curing', stamp(today, -12, 8 * 60 + 30));
  await weighStage(seeding, lot, 'cured', '4.18 kg', stamp(today, -4, 7 * 60 + 30));
  const batch = await seeding.deps.process.batch(lot);
  const controls = await seeding.deps.process.controlsOf(batch);
  const smoke = stamp(today, -3, 9 * 60);
  const cure = { from: stamp(today, -12, 9 * 60), minutes: 8 * 24 * 60 };
  const points = dayOfProcess(controls, { cure, smoke }, { over: true });
  // The chamber reading over its limit, and the rest of the record after it.
  const overAt = points.find(
    ({ control, point }) =>
      control.measure === 'chamber-temperature' &&
      control.rule !== 'curing-room' &&
      point.at === after(smoke, OVER_INDEX * 30),
  );
  const first = points.filter((p) => !overAt || p.point.at <= overAt.point.at);
  const opened = overAt ? await readings(seeding, lot, first, after(overAt.point.at, 2)) : [];
  for (const id of opened)
    await recordAction(
      seeding.deps,
      id,
      {
        cause: 'The smoker damper stuck half closed after the wood change, so the chamber ran hot.',
        restored:
          'Damper freed and the fire banked; the chamber read back inside its limit within 20 minutes.',
        prevention:
          'The damper is checked at every wood change; added to the smoker start-up list.',
        disposition: 'reworked',
      },
      by(crew.tobin, after(overAt!.point.at, 25)),
    );
  const rest = points.filter((p) => !first.includes(p));
  const end = rest[rest.length - 1]?.point.at ?? after(smoke, 300);
  if (rest.length) await readings(seeding, lot, rest, after(end, 5));
  await weighStage(seeding, lot, 'smoked', '3.77 kg', after(smoke, 270));
  await weighStage(seeding, lot, 'sliced', '3.56 kg', stamp(today, -2, 10 * 60));
  await move(seeding, lot, 'done', stamp(today, -2, 11 * 60));
  await verifyBatch(
    seeding.deps,
    lot,
    'Weights, smoker and chill records checked; the damper deviation is closed.',
    seeding.context.config.workflow,
    by(crew.imke, stamp(today, -1, 15 * 60)),
  ).catch(() => undefined);
}

/** The demo formulas tried, in order, for a batch cooling now: the first with a cooling control. */
const COOLING_FORMULAS = ['hot-link-cure', 'ham-pump', 'brisket-brine', 'quillmoor-belly'];

/** A batch cooling now: its cook met, its cool under way, so the console shows a stage deadline. */
async function coolingNow(seeding: Seeding): Promise<void> {
  const { now, today } = seeding;
  for (const formulaId of COOLING_FORMULAS) {
    const current = await seeding.history.current(formulaId).catch(() => undefined);
    if (!current) continue;
    const written = (current.formula as { controls?: unknown[] }).controls;
    if (!written?.length) continue;
    const lot = await record(
      seeding,
      formulaId,
      current.formula.kind === 'cure' ? { meat: '9.6 kg', start: today } : { start: today },
      'in-progress',
      after(now.toISOString(), -7 * 60),
    );
    if (!lot) continue;
    const controls = await seeding.deps.process.controlsOf(await seeding.deps.process.batch(lot));
    if (!controls.some((c) => c.limit.type === 'cooling')) continue;
    await weighLines(seeding, lot, after(now.toISOString(), -6 * 60 - 50));
    // The cool began half an hour ago; everything before it kept to its limits.
    const cooling = controls.findIndex((c) => c.limit.type === 'cooling');
    const began = after(now.toISOString(), -30);
    const points = [
      ...dayOfProcess(controls.slice(0, cooling), { smoke: after(began, -250) }).filter(
        (p) => p.point.at < began,
      ),
      ...demoReadings(controls[cooling], began, 25).map((point) => ({
        control: controls[cooling],
        point,
      })),
    ];
    await readings(seeding, lot, points, after(now.toISOString(), -5));
    return;
  }
}

/** A belly planned for tomorrow, waiting to be started on what is really there. */
async function plannedBelly(seeding: Seeding): Promise<void> {
  await record(
    seeding,
    'quillmoor-belly',
    { meat: '4.4 kg', thickness: '4 cm', start: addDays(seeding.today, 1) },
    'planned',
    stamp(seeding.today, -1, 15 * 60 + 40),
  );
}

/**
 * The demo kitchen's process records: a smoked belly weighed, read, corrected and released; a
 * batch cooling now; a belly planned to start. Deterministic for a given moment; the formulas'
 * revisions are noted in their history first, so each batch's controls are known.
 */
export async function seedProcess(context: AppContext, now = new Date()): Promise<void> {
  const [tobin, imke] = await Promise.all(
    ['tobin', 'imke'].map((name) => context.people.findByUsername(name)),
  );
  if (!tobin || !imke) return;
  const seeding = seedingOf(context, { tobin, imke }, now);
  await smokedBelly(seeding);
  await coolingNow(seeding);
  await plannedBelly(seeding);
}

/**
 * What a demo story works with, `crew.tobin` the cook who records: the formulas' revisions are
 * noted in their history first, so each batch's controls are known.
 */
export function seedingOf(context: AppContext, crew: Crew, now: Date): Seeding {
  const history = new FormulaHistory(context.formulas, context.db, context.audit);
  return {
    context,
    history,
    deps: processDeps({ db: context.db, audit: context.audit, history }),
    crew,
    now,
    today: now.toISOString().slice(0, 10),
  };
}
