import { readFileSync } from 'node:fs';
import path from 'node:path';
import { Command, InvalidArgumentError, Option } from 'commander';
import type { BatchOptionName } from '../../shared/calculation/batch-option-names.ts';
import type { PdfTarget } from '../output/pdf-file.ts';
import {
  BatchError,
  calculate,
  parseBatchOptions,
  presentResult,
  type PresentedResult,
  type RawBatchOptions,
  type UnitSystem,
} from '../../shared/index.ts';
import { CliError, EXIT, EXIT_CODES_HELP } from '../cli-error.ts';
import { formulasFolder, loadFormula } from '../formula-files.ts';
import { libraryIn, partsFolder } from '../formula-library.ts';
import { today, type Io } from '../io.ts';
import { renderBatchSheet } from '../output/batch-sheet.ts';
import { recordKeeper, serverOption, siteOption } from '../records/record-keeper.ts';

/**
 * Every batch option's flag, value name and help, in the order --help lists them. Commander turns
 * --largest-piece into largestPiece, the option's name.
 */
const BATCH_OPTIONS: Readonly<Record<BatchOptionName, readonly [flags: string, help: string]>> = {
  meat: [
    '--meat <weight>',
    'cure: green (trimmed, uncured) meat weight, e.g. 4.26kg or "9 lb 6 oz"',
  ],
  want: ['--want <weight>', 'cure, blend: finished weight wanted; worked back through the yields'],
  thickness: ['--thickness <length>', 'cure: thickness of the thickest piece, e.g. 4cm or 1.5in'],
  largestPiece: [
    '--largest-piece <weight>',
    'cure: weight of the heaviest piece, for per-kg or per-lb hold rules',
  ],
  water: [
    '--water <amount>',
    "brine cure: water by weight or volume (1 L = 1 kg), instead of the formula's",
  ],
  pump: [
    '--pump <percent>',
    "pump cure: brine injected, % of green weight, instead of the formula's",
  ],
  pumpedWeight: [
    '--pumped-weight <weight>',
    'pump cure: weight after injecting; checks the pump % reached',
  ],
  pieces: ['--pieces <count>', 'dough: number of pieces'],
  piece: ['--piece <weight>', "dough: piece weight, instead of the formula's"],
  loss: ['--loss <percent>', 'dough: dough lost in mixing and dividing, % of the mixed dough'],
  flour: ['--flour <weight>', 'dough: scale to this total flour weight'],
  total: ['--total <weight>', 'dough: mixed dough weight; blend: meat weight; mix: total weight'],
  ddt: ['--ddt <temperature>', "dough: desired dough temperature, instead of the formula's"],
  room: ['--room <temperature>', 'dough: room temperature'],
  flourTemp: ['--flour-temp <temperature>', 'dough: flour temperature'],
  prefermentTemp: ['--preferment-temp <temperature>', 'dough: preferment temperature'],
  tap: [
    '--tap <temperature>',
    'dough: tap water temperature; ice is added when colder water is needed',
  ],
  friction: [
    '--friction <rise>',
    "dough: mixer friction factor as a temperature rise, e.g. 14F, instead of the formula's",
  ],
  yeast: [
    '--yeast <kind>',
    "dough: use fresh, active-dry or instant yeast instead of the formula's",
  ],
  targetFat: ['--target-fat <percent>', "blend: fat % wanted, instead of the formula's"],
  onHand: [
    '--on-hand <key=weight>',
    'blend: a trimming fixed by what is on hand, e.g. lean=12kg; give it for each such trimming',
  ],
  fatTest: [
    '--fat-test <key=percent>',
    "blend: fat % measured today for a trimming, e.g. lean=18.5, instead of the formula's; repeatable",
  ],
  portion: ['--portion <weight>', "blend: portion weight, instead of the formula's"],
  base: ['--base <weight>', 'mix: weight of the base ingredient'],
  count: [
    '--count <number>',
    'assembly: units made (burgers, packs); the parts come from their formulas',
  ],
  start: [
    '--start <date>',
    'day the batch starts, YYYY-MM-DD, within a year of today (default: today)',
  ],
};

/** The batch options' names with their flag and help, in the order of BATCH_OPTIONS. */
function batchOptionEntries(): [BatchOptionName, readonly [string, string]][] {
  return Object.entries(BATCH_OPTIONS) as [BatchOptionName, readonly [string, string]][];
}

/** Options that may be given several times; their KEY=VALUE entries are joined with commas. */
const REPEATABLE: ReadonlySet<keyof RawBatchOptions> = new Set(['onHand', 'fatTest']);

/** A value parser that gathers every KEY=VALUE given, as one comma-separated list. */
function gathered(value: string, previous: string | undefined): string {
  return previous === undefined ? value : `${previous}, ${value}`;
}

/** A value parser that refuses an option given twice, instead of silently keeping the last. */
function onlyOnce(flags: string): (value: string, previous: string | undefined) => string {
  return (value, previous) => {
    if (previous !== undefined)
      throw new InvalidArgumentError(`${flags.split(' ')[0]} is given twice`);
    return value;
  };
}

interface CalcOptions extends RawBatchOptions {
  units: UnitSystem;
  json?: boolean;
  formulas?: string;
  record?: boolean;
  server?: string;
  /** The site of the group to work at. */
  site?: string;
  status?: 'planned' | 'in-progress' | 'done';
  notes?: string;
  pdf?: string;
  force?: boolean;
}

/** `larder calc FORMULA`: the batch sheet for one batch. */
export function calcCommand(io: Io): Command {
  const command = new Command('calc')
    .description('work out one batch of a formula: what to weigh, checks, hold time and cautions')
    .argument('<formula>', 'formula file path, or a formula id from the formulas folder')
    .addOption(
      new Option('--units <system>', 'print in metric or US units')
        .choices(['metric', 'us'])
        .default(process.env.LARDER_UNITS === 'us' ? 'us' : 'metric'),
    )
    .option('--json', 'print the result as JSON (exact values as strings)')
    .option(
      '--formulas <folder>',
      'folder to look formula ids up in (default: $LARDER_FORMULAS or ./formulas)',
    )
    .option(
      '--record',
      'record the batch with its lot code (as $LARDER_USER, password in $LARDER_PASSWORD)',
    )
    .addOption(serverOption('with --record: record on this server'))
    .addOption(siteOption())
    .addOption(
      new Option(
        '--status <status>',
        'with --record: planned, or in-progress (the default); an assembly: planned, or done (its default: made on its day)',
      ).choices(['planned', 'in-progress', 'done']),
    )
    .option('--notes <text>', 'with --record: a note kept with the batch')
    .option(
      '--pdf <file>',
      'write the batch sheet to a PDF file instead of printing it (A4; Letter in US units)',
    )
    .option('--force', 'with --pdf: replace the file if it exists');
  for (const [key, [flags, help]] of batchOptionEntries())
    command.option(flags, help, REPEATABLE.has(key) ? gathered : onlyOnce(flags));
  return command
    .addHelpText(
      'after',
      `
Examples:
  larder calc formulas/quillmoor-belly.yaml --meat 4.26kg --thickness 4cm
  larder calc quillmoor-belly --meat "9 lb 6 oz" --thickness 1.5in --units us
  larder calc ham-pump --meat 6kg --largest-piece 3kg --pumped-weight 6.7kg
  larder calc pit-bun --pieces 48 --piece 90g --loss 3 --room 22C --flour-temp 20C --preferment-temp 19C --tap 16C
  larder calc chuck-grind --total 20kg --target-fat 20
  larder calc chuck-grind --on-hand lean=12kg --json
  larder calc chuck-grind --total 20kg --fat-test lean=17.5
  larder calc bacon-pack --count 40
  larder calc smokehouse-burger --count 120 --record
  LARDER_USER=tobin LARDER_PASSWORD=… larder calc quillmoor-belly --meat 4.26kg --thickness 4cm --record
  larder calc quillmoor-belly --meat 4.26kg --record --server http://127.0.0.1:4310
  larder calc quillmoor-belly --meat 4.26kg --thickness 4cm --pdf belly-sheet.pdf
  larder calc quillmoor-belly --meat 4.26kg --thickness 4cm --record --pdf sheet.pdf --force
${EXIT_CODES_HELP}`,
    )
    .action((reference: string, options: CalcOptions) => runCalc(reference, options, io));
}

async function runCalc(reference: string, options: CalcOptions, io: Io): Promise<void> {
  const { formula, file, warnings } = loadFormula(reference, formulasFolder(options.formulas));
  const day = today();
  const raw: RawBatchOptions = { start: day };
  for (const [key] of batchOptionEntries()) if (options[key] !== undefined) raw[key] = options[key];
  for (const warning of warnings) io.err(`${warning}\n`);
  if (!options.record && (options.server || options.status || options.notes)) {
    throw new CliError('--server, --status and --notes go with --record', EXIT.usage);
  }
  if (options.force && !options.pdf) throw new CliError('--force goes with --pdf', EXIT.usage);
  const pdf: PdfTarget | undefined = options.pdf
    ? { file: options.pdf, force: !!options.force }
    : undefined;
  // The PDF tools load only when a PDF is asked for, so a plain calc starts as fast as before.
  // The path is checked before anything is worked out or recorded.
  if (pdf) await (await import('../output/pdf-file.ts')).checkPdfTarget(pdf);
  if (options.record) return recordBatch(formula.id, file, raw, options, pdf, io);
  // An assembly's parts are worked out from their own formulas, read when one is asked for.
  const library =
    formula.kind === 'assembly'
      ? libraryIn(partsFolder(reference, file, options.formulas), file, io)
      : undefined;
  let result;
  try {
    result = calculate(formula, parseBatchOptions(raw, formula, { today: day }), library);
  } catch (error) {
    if (error instanceof BatchError) throw new CliError(error.message, EXIT.usage);
    throw error;
  }
  const presented = presentResult(result, options.units);
  if (pdf) {
    const [{ writeBatchSheet }, { revisionOf }] = await Promise.all([
      import('../output/pdf-file.ts'),
      import('../../files/revision.ts'),
    ]);
    const revision = revisionOf(readFileSync(file, 'utf8'));
    await writeBatchSheet(pdf, presented, undefined, { revision });
  }
  if (options.json) io.out(`${JSON.stringify(presented, null, 2)}\n`);
  else if (pdf) io.out(sheetWritten(pdf, presented));
  else io.out(renderBatchSheet(presented));
  if (presented.critical) process.exitCode = EXIT.critical;
}

/** What --pdf prints instead of the sheet: where it went, and a refusal that must not be missed. */
function sheetWritten(pdf: PdfTarget, result: PresentedResult): string {
  const refused = result.critical
    ? 'REFUSED: a critical limit is failed. Do not make this batch (the sheet says why).\n'
    : '';
  return `${refused}Wrote the batch sheet to ${pdf.file}\n`;
}

/** Records the batch here or on a server; a refused batch exits 4 and nothing is recorded. */
async function recordBatch(
  formulaId: string,
  file: string,
  raw: RawBatchOptions,
  options: CalcOptions,
  pdf: PdfTarget | undefined,
  io: Io,
): Promise<void> {
  const keeper = await recordKeeper(options.server, options.site);
  const batch = await keeper.recordBatch({
    formula: formulaId,
    folder: path.dirname(path.resolve(file)),
    batch: raw,
    units: options.units,
    ...(options.status ? { status: options.status } : {}),
    ...(options.notes ? { notes: options.notes } : {}),
  });
  if (pdf) {
    try {
      await (await import('../output/pdf-file.ts')).writeBatchSheet(pdf, batch.result, batch);
    } catch (error) {
      if (!(error instanceof CliError)) throw error;
      throw new CliError(
        `lot ${batch.lotCode} is recorded, but its sheet was not written: ${error.message}; write it with larder batches show ${batch.lotCode} --pdf FILE`,
        error.exitCode,
      );
    }
  }
  if (options.json) return io.out(`${JSON.stringify(batch, null, 2)}\n`);
  const recorded = `Recorded: lot ${batch.lotCode} · ${batch.status} · by ${batch.operator.displayName}${keeper.server ? ` · on ${keeper.server}` : ''}\n`;
  if (pdf) io.out(`${recorded}${sheetWritten(pdf, batch.result)}`);
  else io.out(`${renderBatchSheet(batch.result)}\n${recorded}`);
}
