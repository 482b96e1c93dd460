import { Command, Option } from 'commander';
import {
  FORMULA_REFUSALS,
  PlanError,
  isIsoDate,
  planAssembly,
  presentPlan,
  type FormulaLibrary,
  type PlanResult,
  type PlanStock,
  type PresentedPlan,
  type UnitSystem,
} from '../../shared/index.ts';
import type { PlanWithStock } from '../../shared/api/plan-record.ts';
import { CliError, EXIT, EXIT_CODES_HELP } from '../cli-error.ts';
import { formulasFolder, loadFormula } from '../formula-files.ts';
import { libraryIn, partsFolder } from '../formula-library.ts';
import { today, type Io } from '../io.ts';
import type { PdfTarget } from '../output/pdf-file.ts';
import { renderPlanSheet } from '../output/plan-sheet.ts';
import { renderPlanStock } from '../output/plan-stock-sheet.ts';
import {
  localRecordKeeper,
  recordKeeper,
  siteOption,
  type PlanToRecord,
} from '../records/record-keeper.ts';

interface PlanOptions {
  count: string;
  for: string;
  today?: string;
  units: UnitSystem;
  json?: boolean;
  formulas?: string;
  record?: boolean;
  again?: boolean;
  server?: string;
  /** The site of the group to work at. */
  site?: string;
  pdf?: string;
  force?: boolean;
}

/** What a recorded batch is printed with. */
interface RecordedBatch {
  lotCode: string;
  formula: { id: string; title: string };
  status: string;
  startedOn: string;
  readyOn: string | null;
}

/** `larder plan ASSEMBLY`: every batch an assembly needs for a count and a service day. */
export function planCommand(io: Io): Command {
  return new Command('plan')
    .description(
      'plan a menu item (an assembly) for a count and a service day: every batch it needs, the day each starts, one pull list, the allergens',
    )
    .argument('<assembly>', 'assembly file path, or its id in the formulas folder')
    .requiredOption('--count <units>', 'how many units to serve (plates, sandwiches)')
    .requiredOption('--for <date>', 'the day of service, YYYY-MM-DD')
    .option(
      '--today <date>',
      'the day the plan is made, YYYY-MM-DD, to plan as if on another day (default: today; not with --record)',
    )
    .addOption(
      new Option('--units <system>', 'print in metric or US units')
        .choices(['metric', 'us'])
        .default(process.env.LARDER_UNITS === 'us' ? 'us' : 'metric'),
    )
    .option('--json', 'print the plan as JSON (exact values as strings)')
    .option(
      '--formulas <folder>',
      'folder the formulas are read from (default: the assembly file’s folder, else $LARDER_FORMULAS or ./formulas)',
    )
    .option(
      '--record',
      "record every batch as planned, starting on its day, and the menu item's own for the service day (as $LARDER_USER, password in $LARDER_PASSWORD)",
    )
    .option(
      '--again',
      'with --record: record the batches again even if this plan was recorded before',
    )
    .addOption(
      new Option(
        '--server <url>',
        'plan on this server and compare the pull list with its stock; with --record, record there (for --record the default is $LARDER_SERVER, else this machine)',
      ),
    )
    .addOption(siteOption())
    .option(
      '--pdf <file>',
      'write the plan to a PDF file: an overview, then one production sheet per start day',
    )
    .option('--force', 'with --pdf: replace the file if it exists')
    .addHelpText(
      'after',
      `
Examples:
  larder plan smokehouse-burger --count 120 --for 2026-12-18
  larder plan smokehouse-burger --count 120 --for 2026-12-18 --pdf burger-plan.pdf
  larder plan smokehouse-burger --count 120 --for 2026-12-18 --units us --json
  LARDER_USER=tobin LARDER_PASSWORD=… larder plan corned-beef-sandwich --count 60 --for 2026-12-18 --record
${EXIT_CODES_HELP}
  (2 also when the plan cannot be made: a batch that would start before today, a service day
   more than a year ahead, or a batch too big; and with --record, when batches were recorded
   for the same menu item and service day before, unless --again)`,
    )
    .action((reference: string, options: PlanOptions) => runPlan(reference, options, io));
}

function readCount(text: string): number {
  if (!/^\d+$/.test(text.trim())) {
    throw new CliError(
      `--count takes a whole number of units, such as 120, not "${text}"`,
      EXIT.usage,
    );
  }
  return Number(text.trim());
}

function readDate(text: string, option: string): string {
  if (!isIsoDate(text)) {
    throw new CliError(`--${option} takes a date written YYYY-MM-DD, not "${text}"`, EXIT.usage);
  }
  return text;
}

/** A refused plan as the command's failure: formula problems exit 3, a critical limit 4, else 2. */
function planFailure(error: PlanError): CliError {
  const code =
    error.reason === 'critical-limit'
      ? EXIT.critical
      : FORMULA_REFUSALS.includes(error.reason)
        ? EXIT.formula
        : EXIT.usage;
  return new CliError(error.message, code);
}

async function runPlan(reference: string, options: PlanOptions, io: Io): Promise<void> {
  const count = readCount(options.count);
  const serviceDate = readDate(options.for, 'for');
  const planned = options.today === undefined ? today() : readDate(options.today, 'today');
  if (options.again && !options.record)
    throw new CliError('--again goes with --record', EXIT.usage);
  if (options.force && !options.pdf) throw new CliError('--force goes with --pdf', EXIT.usage);
  const pdf: PdfTarget | undefined = options.pdf
    ? { file: options.pdf, force: !!options.force }
    : undefined;
  // The file is checked before anything is recorded, so a bad path records nothing.
  if (pdf) await (await import('../output/pdf-file.ts')).checkPdfTarget(pdf);
  // A recorded batch's lot code carries its start day; a pretended today could put it a century
  // off, where its two-digit year reads as this one.
  if (options.record && options.today) {
    throw new CliError(
      '--today cannot be used with --record: recorded batches start from today (the server’s, with --server)',
      EXIT.usage,
    );
  }
  if (options.server && options.today) {
    throw new CliError(
      '--today cannot be used with --server: the server plans from its own today',
      EXIT.usage,
    );
  }
  const { formula, file, warnings } = loadFormula(reference, formulasFolder(options.formulas));
  for (const warning of warnings) io.err(`${warning}\n`);
  if (formula.kind !== 'assembly') {
    throw new CliError(
      `${formula.id} is a ${formula.kind}, not an assembly: work out one batch of it with \`larder calc ${formula.id}\``,
      EXIT.usage,
    );
  }
  const folder = partsFolder(reference, file, options.formulas);
  // Made once, when first asked for: a server makes its own plan.
  let library: FormulaLibrary | undefined;
  const formulas = (): FormulaLibrary => (library ??= libraryIn(folder, file, io));
  let made: PlanResult | undefined;
  const plan = (): PlanResult => {
    try {
      made ??= planAssembly(formula, formulas(), { count, serviceDate, today: planned });
      return made;
    } catch (error) {
      if (error instanceof PlanError) throw planFailure(error);
      throw error;
    }
  };
  const request: PlanToRecord = {
    assembly: formula.id,
    count,
    serviceDate,
    units: options.units,
    folder,
    plan,
    formulas,
    again: options.again === true,
  };
  const json = options.json === true;
  if (options.record) {
    const keeper = await recordKeeper(options.server, options.site);
    const recorded = await keeper.recordPlan(request);
    const stock = (await keeper.planStock(request))?.stock;
    if (pdf) await writePlanPdf(pdf, recorded.plan);
    return printRecorded(recorded.plan, recorded.batches, io, json, keeper.server, pdf, stock);
  }
  // With --server the server plans and compares with its stock; else this machine's records,
  // when it keeps any, give the stock.
  const keeper = options.server
    ? await recordKeeper(options.server, options.site)
    : await localRecordKeeper(options.site);
  const withStock = options.server ? await keeper.planStock(request) : undefined;
  const presented = withStock ? withoutStock(withStock) : presentPlan(plan(), options.units);
  const stock = withStock?.stock ?? (await keeper.planStock(request))?.stock;
  if (pdf) await writePlanPdf(pdf, presented);
  if (json) io.out(`${JSON.stringify(stock ? { ...presented, stock } : presented, null, 2)}\n`);
  else {
    io.out(pdf ? `Wrote the plan to ${pdf.file}\n` : renderPlanSheet(presented));
    if (stock) io.out(renderPlanStock(stock));
  }
}

/** The plan of an answer that carries its stock, alone. */
function withoutStock({ stock: _stock, ...plan }: PlanWithStock): PresentedPlan {
  return plan;
}

/** Renders the plan's sheets and writes them whole (the PDF stack loads only here). */
async function writePlanPdf(target: PdfTarget, plan: PresentedPlan): Promise<void> {
  await (await import('../output/pdf-file.ts')).writePlanSheet(target, plan);
}

function printRecorded(
  plan: PresentedPlan,
  batches: readonly RecordedBatch[],
  io: Io,
  json: boolean,
  url?: string,
  pdf?: PdfTarget,
  stock?: PlanStock,
): void {
  if (json) {
    io.out(`${JSON.stringify({ plan, batches, ...(stock ? { stock } : {}) }, null, 2)}\n`);
    return;
  }
  io.out(pdf ? `Wrote the plan to ${pdf.file}\n` : renderPlanSheet(plan));
  if (stock) io.out(renderPlanStock(stock));
  io.out(`\nRecorded ${batches.length} planned batch(es)${url ? ` on ${url}` : ''}:\n`);
  for (const batch of batches) {
    io.out(
      `  lot ${batch.lotCode} · ${batch.formula.id} · starts ${batch.startedOn}${batch.readyOn ? ` · ready ${batch.readyOn}` : ''}\n`,
    );
  }
}
