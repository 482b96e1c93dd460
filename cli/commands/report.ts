import { Command } from 'commander';
import type { HaccpReport, ReportBatch } from '../../shared/api/haccp-report.ts';
import { EXIT_CODES_HELP } from '../cli-error.ts';
import type { Io } from '../io.ts';
import { textTable } from '../output/text-table.ts';
import { reportFile, writeReportFile } from '../output/report-file.ts';
import { recordKeeper, serverOption, siteOption } from '../records/record-keeper.ts';

interface ReportOptions {
  from?: string;
  to?: string;
  pdf?: string;
  csv?: string;
  json?: boolean;
  force?: boolean;
  server?: string;
  site?: string;
}

/** One batch as a line of the summary: its controls, deviations and release. */
function batchRow(batch: ReportBatch): string[] {
  const missed = batch.controls.filter((c) => c.state.startsWith('missed')).length;
  const open = batch.deviations.filter((d) => !d.action).length;
  const released = batch.verifications.some((v) => v.correctedBy === null);
  return [
    batch.lotCode,
    batch.formula.id,
    batch.status,
    `${batch.controls.length}${missed ? ` (${missed} missed)` : ''}`,
    `${batch.deviations.length}${open ? ` (${open} OPEN)` : ''}`,
    released ? 'released' : '',
  ];
}

/** The report in short, for a terminal: the head, a line per batch, then the period's other records. */
function summary(report: HaccpReport): string {
  const header = ['lot', 'formula', 'status', 'controls', 'deviations', 'verified'];
  const table = textTable(
    [header, ...report.batches.map(batchRow)],
    header.map(() => 'left'),
  ).join('\n');
  return (
    `HACCP records, ${report.kitchen}: ${report.from} to ${report.to} (${report.timeZone}), produced by ${report.producedBy}\n\n` +
    `${report.batches.length ? table : 'No batches in the period.'}\n\n` +
    `${report.batches.length} batch(es); ${report.refusals.length} refused calculation(s); ` +
    `${report.equipment.length} piece(s) of equipment with logs.\n` +
    'Write it whole with --pdf FILE or --csv FILE.\n'
  );
}

/** `larder report`: the HACCP records report of a period, as PDF, CSV, JSON or a summary. */
export function reportCommand(io: Io): Command {
  return new Command('report')
    .description('the HACCP records report of a period: every batch with its process records')
    .option('--from <date>', 'first day, YYYY-MM-DD (default: 29 days before --to)')
    .option('--to <date>', 'last day, YYYY-MM-DD (default: today)')
    .option('--pdf <file>', 'write the report as a PDF file')
    .option('--csv <file>', 'write the report as CSV, one line per record entry')
    .option('--force', 'with --pdf or --csv: replace the file if it exists')
    .addOption(serverOption('from this server'))
    .addOption(siteOption())
    .option('--json', 'print the report as JSON')
    .addHelpText(
      'after',
      `\nSigns in as $LARDER_USER with $LARDER_PASSWORD (admin or reviewer); producing it is written\nin the audit log.\n\nExamples:\n  larder report --from 2026-11-01 --to 2026-11-30 --pdf haccp-november.pdf\n  larder report --csv haccp.csv                          # the last 30 days\n${EXIT_CODES_HELP}`,
    )
    .action(async (options: ReportOptions) => {
      const { format, target } = await reportFile(options);
      const period = {
        ...(options.from ? { from: options.from } : {}),
        ...(options.to ? { to: options.to } : {}),
      };
      const report = await (
        await recordKeeper(options.server, options.site)
      ).report(format, period);
      if (report.format === 'json')
        return io.out(
          options.json ? `${JSON.stringify(report.body, null, 2)}\n` : summary(report.body),
        );
      if (target) await writeReportFile(target, report);
      io.out(`Wrote the HACCP records report to ${target?.file}\n`);
    });
}
