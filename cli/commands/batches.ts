import { Command } from 'commander';
import { CliError, EXIT, EXIT_CODES_HELP } from '../cli-error.ts';
import type { Io } from '../io.ts';
import { renderBatchSheet } from '../output/batch-sheet.ts';
import { textTable } from '../output/text-table.ts';
import { recordKeeper, serverOption, siteOption } from '../records/record-keeper.ts';

const FILTERS = [
  'formula',
  'kind',
  'status',
  'operator',
  'from',
  'to',
  'lot',
  'sort',
  'order',
  'limit',
  'cursor',
] as const;

interface ShowOptions {
  server?: string;
  /** The site of the group to work at. */
  site?: string;
  json?: boolean;
  pdf?: string;
  force?: boolean;
}

interface ListOptions extends Partial<Record<(typeof FILTERS)[number], string>> {
  server?: string;
  /** The site of the group to work at. */
  site?: string;
  json?: boolean;
}

/** `larder batches list|show`: read the batch log, on this machine or on a server. */
export function batchesCommand(io: Io): Command {
  const batches = new Command('batches').description(
    'read the batch log (this machine, or --server)',
  );

  batches
    .command('list')
    .description('list recorded batches, newest first')
    .option('--formula <id>', 'only this formula')
    .option('--kind <kind>', 'only cure, dough, blend or mix')
    .option(
      '--status <list>',
      'only these statuses, comma-separated (planned,in-progress,curing,proofing,done,discarded)',
    )
    .option('--operator <id>', 'only batches recorded by this person id')
    .option('--from <date>', 'recorded on or after YYYY-MM-DD')
    .option('--to <date>', 'recorded on or before YYYY-MM-DD')
    .option('--lot <prefix>', 'lot codes starting with this')
    .option('--sort <key>', 'recorded, lot, started, ready, status or formula')
    .option('--order <order>', 'asc or desc')
    .option('--limit <n>', 'batches per page, 1–200 (default 50)')
    .option('--cursor <cursor>', 'the page after this one (printed at the end of a page)')
    .addOption(serverOption('read from this server'))
    .addOption(siteOption())
    .option('--json', 'print the page as JSON')
    .addHelpText(
      'after',
      `\nOn a server, signs in as $LARDER_USER with $LARDER_PASSWORD.\n\nExamples:\n  larder batches list --status curing,proofing\n  larder batches list --formula quillmoor-belly --from 2026-11-01 --json\n${EXIT_CODES_HELP}`,
    )
    .action(async (options: ListOptions) => {
      const query: Record<string, string> = {};
      for (const key of FILTERS) if (options[key] !== undefined) query[key] = options[key];
      const page = await (await recordKeeper(options.server, options.site)).listBatches(query);
      if (options.json) return io.out(`${JSON.stringify(page, null, 2)}\n`);
      const rows = page.items.map((b) => [
        b.lotCode,
        b.formula.id,
        b.status,
        b.startedOn,
        b.readyOn ?? '',
        b.checksPassed ? 'pass' : 'FAIL',
        b.signedOff ? 'signed' : '',
        b.operator.displayName,
      ]);
      const header = [
        'lot',
        'formula',
        'status',
        'started',
        'ready',
        'checks',
        'sign-off',
        'operator',
      ];
      io.out(
        `${textTable(
          [header, ...rows],
          header.map(() => 'left'),
        ).join('\n')}\n`,
      );
      io.out(
        `${page.items.length} of ${page.total}${page.totalExact === false ? '+' : ''} batch(es)${page.next ? `; next page: --cursor ${page.next}` : ''}\n`,
      );
    });

  batches
    .command('show')
    .description('one batch: its sheet as recorded, checks, and every event')
    .argument('<lot>', 'lot code')
    .addOption(serverOption('read from this server'))
    .addOption(siteOption())
    .option('--json', 'print the batch as JSON')
    .option('--pdf <file>', 'write the batch sheet as recorded to a PDF file, with its lot code')
    .option('--force', 'with --pdf: replace the file if it exists')
    .addHelpText(
      'after',
      `\nOn a server, signs in as $LARDER_USER with $LARDER_PASSWORD.\n\nExamples:\n  larder batches show 261202-QB-01\n  larder batches show 261202-QB-01 --pdf 261202-QB-01.pdf\n${EXIT_CODES_HELP}`,
    )
    .action(async (lot: string, options: ShowOptions) => {
      if (options.force && !options.pdf) throw new CliError('--force goes with --pdf', EXIT.usage);
      const pdf = options.pdf ? { file: options.pdf, force: !!options.force } : undefined;
      // The PDF tools load only for --pdf; the path is checked before the batch is read.
      if (pdf) await (await import('../output/pdf-file.ts')).checkPdfTarget(pdf);
      const batch = await (await recordKeeper(options.server, options.site)).showBatch(lot);
      if (pdf)
        await (await import('../output/pdf-file.ts')).writeBatchSheet(pdf, batch.result, batch);
      if (options.json) return io.out(`${JSON.stringify(batch, null, 2)}\n`);
      if (pdf) return io.out(`Wrote the sheet of lot ${batch.lotCode} to ${pdf.file}\n`);
      io.out(
        `Lot ${batch.lotCode} · ${batch.status} · started ${batch.startedOn}${batch.readyOn ? ` · ready ${batch.readyOn}` : ''} · by ${batch.operator.displayName}\n`,
      );
      io.out(
        batch.signedOff
          ? `Signed off by ${batch.signedOff.by.displayName} at ${batch.signedOff.at}\n`
          : 'Not signed off.\n',
      );
      io.out(`\n${renderBatchSheet(batch.result)}`);
      if (batch.events?.length) {
        io.out('\nEVENTS\n');
        const rows = batch.events.map((e) => [
          e.at,
          e.type,
          e.from && e.to ? `${e.from} → ${e.to}` : (e.to ?? ''),
          e.by?.displayName ?? '',
          e.reason ?? '',
        ]);
        io.out(`${textTable(rows, ['left', 'left', 'left', 'left', 'left']).join('\n')}\n`);
      }
    });

  for (const command of batches.commands)
    command
      .exitOverride()
      .configureOutput({ writeOut: (t) => io.out(t), writeErr: (t) => io.err(t) });
  return batches;
}
