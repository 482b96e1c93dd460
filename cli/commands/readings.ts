import { readFile } from 'node:fs/promises';
import { Command } from 'commander';
import { CliError, EXIT, EXIT_CODES_HELP } from '../cli-error.ts';
import type { Io } from '../io.ts';
import { reportDeviations } from '../output/process-words.ts';
import { recordKeeper, serverOption, siteOption } from '../records/record-keeper.ts';

interface ReadingsOptions {
  server?: string;
  /** The site of the group to work at. */
  site?: string;
  json?: boolean;
}

/** The logger file's text; a file that cannot be read is the command line's fault. */
async function loggerText(file: string): Promise<string> {
  try {
    return await readFile(file, 'utf8');
  } catch (error) {
    throw new CliError(`cannot read ${file}: ${(error as Error).message}`, EXIT.usage);
  }
}

/** `larder readings LOT CONTROL FILE.csv`: a data logger's export, stored all or nothing. */
export function readingsCommand(io: Io): Command {
  return new Command('readings')
    .description("store a data logger's CSV export as readings at a batch's control")
    .argument('<lot>', 'lot code')
    .argument('<control>', "the control's id in the formula, e.g. chill")
    .argument('<file>', "the logger's CSV export (time, temperature per line)")
    .addOption(serverOption('store on this server'))
    .addOption(siteOption())
    .option('--json', 'print what was stored and the deviations opened as JSON')
    .addHelpText(
      'after',
      `\nSigns in as $LARDER_USER with $LARDER_PASSWORD (admin, cook or reviewer). A line that cannot\nbe read refuses the whole file (exit 2), naming the line: nothing is stored. Readings that miss\nthe critical limit open deviations (exit 5).\n\nExample:\n  larder readings 261202-QB-01 chill logger-0412.csv\n${EXIT_CODES_HELP}`,
    )
    .action(async (lot: string, control: string, file: string, options: ReadingsOptions) => {
      const text = await loggerText(file);
      const keeper = await recordKeeper(options.server, options.site);
      let stored;
      try {
        stored = await keeper.uploadReadings(lot, control, text);
      } catch (error) {
        // The file's name in front of the line at fault: "chill.csv: … line 12: …".
        if (error instanceof CliError && /\bline \d+\b/.test(error.message))
          throw new CliError(`${file}: ${error.message}`, error.exitCode, error.details);
        throw error;
      }
      if (options.json) io.out(`${JSON.stringify(stored, null, 2)}\n`);
      else io.out(`${file}, ${control} of lot ${lot.toUpperCase()}: ${stored.message}\n`);
      reportDeviations(io, stored.deviations, !!options.json);
    });
}
