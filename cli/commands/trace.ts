import { Command } from 'commander';
import { EXIT_CODES_HELP } from '../cli-error.ts';
import type { Io } from '../io.ts';
import { traceText } from '../output/trace-text.ts';
import { recordKeeper, serverOption, siteOption } from '../records/record-keeper.ts';

/** `larder trace LOT`: everything that went into a lot, and everywhere it went. */
export function traceCommand(io: Io): Command {
  return new Command('trace')
    .description('trace a lot back (what went into it) and forward (where it went)')
    .argument('<lot>', "a batch's lot code (261203-QB-01) or a received lot's (R261203-01)")
    .option('--json', 'print both traces as JSON')
    .addOption(serverOption('from this server'))
    .addOption(siteOption())
    .addHelpText(
      'after',
      `\nFrom a server, signs in as $LARDER_USER with $LARDER_PASSWORD (any role).\n\nExamples:\n  larder trace 261206-BA-01\n  larder trace R261203-01 --json\n${EXIT_CODES_HELP}`,
    )
    .action(async (lot: string, options: { json?: boolean; server?: string; site?: string }) => {
      const { back, forward } = await (await recordKeeper(options.server, options.site)).trace(lot);
      if (options.json) return io.out(`${JSON.stringify({ back, forward }, null, 2)}\n`);
      io.out(
        `${traceText('Made from', back, 'nothing recorded: a received lot, or a batch with no lots recorded')}\n` +
          traceText('Went into', forward, 'no batch has used it'),
      );
    });
}
