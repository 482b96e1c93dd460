import { Command } from 'commander';
import { CliError, EXIT, EXIT_CODES_HELP } from '../cli-error.ts';
import type { Io } from '../io.ts';
import { readingWords, reportDeviations } from '../output/process-words.ts';
import { recordKeeper, serverOption, siteOption } from '../records/record-keeper.ts';

interface ReadingOptions {
  at?: string;
  server?: string;
  /** The site of the group to work at. */
  site?: string;
  json?: boolean;
}

/**
 * `--at` as the server takes it: a time with its zone, or HH:MM today on this machine's clock
 * (the kitchen's), made into one.
 */
export function readingTime(text: string, now: Date = new Date()): string {
  const clock = /^(\d{1,2}):(\d{2})$/.exec(text);
  if (!clock) return text;
  const [hours, minutes] = [Number(clock[1]), Number(clock[2])];
  if (hours > 23 || minutes > 59)
    throw new CliError(`--at ${text} is not a time of day (HH:MM, 00:00 to 23:59)`, EXIT.usage);
  const at = new Date(now);
  at.setHours(hours, minutes, 0, 0);
  return at.toISOString();
}

/** `larder reading LOT CONTROL VALUE`: a reading at a batch's control, as the cook took it. */
export function readingCommand(io: Io): Command {
  return new Command('reading')
    .description("record a reading at a batch's process control (a critical control point)")
    .argument('<lot>', 'lot code')
    .argument('<control>', "the control's id in the formula, e.g. chill")
    .argument(
      '<value>',
      'what was read: "71.5C", "160 F", "6.2" (pH); the control\'s unit when bare',
    )
    .option('--at <time>', 'when it was taken: HH:MM today, or ISO 8601 with a zone (default: now)')
    .addOption(serverOption('record on this server'))
    .addOption(siteOption())
    .option('--json', "print the reading, the control's state and any deviation as JSON")
    .addHelpText(
      'after',
      `\nSigns in as $LARDER_USER with $LARDER_PASSWORD (admin, cook or reviewer). A reading that\nmisses the critical limit is recorded, opens a deviation and exits 5.\n\nExamples:\n  larder reading 261202-QB-01 chill 24.5C\n  larder reading 261202-QB-01 smoker 158F --at 14:30\n${EXIT_CODES_HELP}`,
    )
    .action(async (lot: string, control: string, value: string, options: ReadingOptions) => {
      const request = {
        control,
        value,
        ...(options.at ? { at: readingTime(options.at) } : {}),
      };
      const answer = await (
        await recordKeeper(options.server, options.site)
      ).addReading(lot, request);
      if (options.json) io.out(`${JSON.stringify(answer, null, 2)}\n`);
      else io.out(readingWords(lot.toUpperCase(), value, answer));
      reportDeviations(io, answer.deviation ? [answer.deviation] : [], !!options.json);
    });
}
