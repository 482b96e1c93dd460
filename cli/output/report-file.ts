import { CliError, EXIT } from '../cli-error.ts';
import type { PdfTarget } from './pdf-file.ts';

/** The options of a verb that writes a report: one of a PDF file, a CSV file or JSON. */
export interface ReportFileOptions {
  readonly pdf?: string;
  readonly csv?: string;
  readonly json?: boolean;
  readonly force?: boolean;
}

/** A report's format, and the file it goes to (none for JSON or a summary). */
export interface ReportFile {
  readonly format: 'pdf' | 'csv' | 'json';
  readonly target?: PdfTarget;
}

/**
 * The format and file the options ask for, the file checked before the report is produced (and
 * audited), so a path that cannot be written fails first.
 */
export async function reportFile(options: ReportFileOptions): Promise<ReportFile> {
  const chosen = [options.pdf, options.csv, options.json].filter(Boolean).length;
  if (chosen > 1) throw new CliError('give one of --pdf, --csv or --json', EXIT.usage);
  if (options.force && !options.pdf && !options.csv)
    throw new CliError('--force goes with --pdf or --csv', EXIT.usage);
  const format = options.pdf ? 'pdf' : options.csv ? 'csv' : 'json';
  const file = options.pdf ?? options.csv;
  if (!file) return { format };
  const target = { file, force: !!options.force };
  await (await import('./pdf-file.ts')).checkPdfTarget(target);
  return { format, target };
}

/** Writes a produced PDF or CSV to its checked file. */
export async function writeReportFile(
  target: PdfTarget,
  report: { format: 'pdf'; body: Uint8Array } | { format: 'csv'; body: string },
): Promise<void> {
  const bytes = report.format === 'pdf' ? report.body : Buffer.from(report.body, 'utf8');
  await (await import('./pdf-file.ts')).writePdf(target, bytes);
}
