import { Command } from 'commander';
import type { TraceSearch } from '../../shared/api/trace-record.ts';
import { CliError, EXIT, EXIT_CODES_HELP } from '../cli-error.ts';
import type { Io } from '../io.ts';
import { recallText } from '../output/trace-text.ts';
import { reportFile, writeReportFile } from '../output/report-file.ts';
import { recordKeeper, serverOption, siteOption } from '../records/record-keeper.ts';

interface RecallOptions {
  supplierLot?: string;
  supplier?: string;
  lot?: string;
  pdf?: string;
  csv?: string;
  json?: boolean;
  force?: boolean;
  server?: string;
  site?: string;
}

/** The search the options name: a lot, or a supplier lot with its supplier if given. */
function searchOf(options: RecallOptions): TraceSearch {
  if (options.lot && !options.supplierLot && !options.supplier) return { lot: options.lot };
  if (options.supplierLot && !options.lot)
    return options.supplier
      ? { supplierLot: options.supplierLot, supplier: options.supplier }
      : { supplierLot: options.supplierLot };
  throw new CliError('give --supplier-lot (with --supplier if you like) or --lot', EXIT.usage);
}

/** `larder recall`: the recall report of a supplier lot or a lot, as PDF, CSV, JSON or a summary. */
export function recallCommand(io: Io): Command {
  return new Command('recall')
    .description('the recall report of a supplier lot or a lot: every batch it went into')
    .option('--supplier-lot <lot>', "the supplier's lot number, as on their label or invoice")
    .option('--supplier <name>', 'with --supplier-lot: only deliveries from this supplier')
    .option('--lot <code>', "a received lot's code (R261203-01) or a batch's (261203-QB-01)")
    .option('--pdf <file>', 'write the report as a PDF file')
    .option('--csv <file>', 'write the report as CSV, one line per recalled lot and per use')
    .option('--force', 'with --pdf or --csv: replace the file if it exists')
    .addOption(serverOption('from this server'))
    .addOption(siteOption())
    .option('--json', 'print the report as JSON')
    .addHelpText(
      'after',
      `\nSigns in as $LARDER_USER with $LARDER_PASSWORD (any role); producing it is written in the\naudit log.\n\nExamples:\n  larder recall --supplier-lot 4471 --supplier "Hollin Farm" --pdf recall-4471.pdf\n  larder recall --lot 261204-BG-01 --csv recall.csv\n${EXIT_CODES_HELP}`,
    )
    .action(async (options: RecallOptions) => {
      const search = searchOf(options);
      const { format, target } = await reportFile(options);
      const report = await (
        await recordKeeper(options.server, options.site)
      ).recall(format, search);
      if (report.format === 'json')
        return io.out(
          options.json ? `${JSON.stringify(report.body, null, 2)}\n` : recallText(report.body),
        );
      if (target) await writeReportFile(target, report);
      io.out(`Wrote the recall report to ${target?.file}\n`);
    });
}
