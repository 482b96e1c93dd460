import { Command } from 'commander';
import packageJson from '../package.json' with { type: 'json' };
import { EXIT_CODES_HELP } from './cli-error.ts';
import { backupCommand } from './commands/backup.ts';
import { batchesCommand } from './commands/batches.ts';
import { blendCommand } from './commands/blend.ts';
import { calcCommand } from './commands/calc.ts';
import { checkCommand } from './commands/check.ts';
import { newCommand } from './commands/new.ts';
import { planCommand } from './commands/plan.ts';
import { readingCommand } from './commands/reading.ts';
import { readingsCommand } from './commands/readings.ts';
import { recallCommand } from './commands/recall.ts';
import { traceCommand } from './commands/trace.ts';
import { receiveCommand } from './commands/receive.ts';
import { reportCommand } from './commands/report.ts';
import { stockCommand } from './commands/stock.ts';
import { sitesCommand } from './commands/sites.ts';
import { usersCommand } from './commands/users.ts';
import type { Io } from './io.ts';

/** Builds the larder command with every verb; used by the bin entry and by tests. */
export function createProgram(io: Io): Command {
  const program = new Command('larder')
    .description(
      'Larderbook: exact batches from formula files (cures, dough, blends, mixes) for production kitchens',
    )
    .version(packageJson.version, '-V, --version', 'print the version')
    .showHelpAfterError('(run with --help for usage)')
    .configureOutput({ writeOut: (text) => io.out(text), writeErr: (text) => io.err(text) })
    .exitOverride()
    .addHelpText('after', EXIT_CODES_HELP);
  for (const command of [
    calcCommand(io),
    checkCommand(io),
    planCommand(io),
    blendCommand(io),
    newCommand(io),
    batchesCommand(io),
    readingCommand(io),
    readingsCommand(io),
    reportCommand(io),
    traceCommand(io),
    recallCommand(io),
    receiveCommand(io),
    stockCommand(io),
    usersCommand(io),
    sitesCommand(io),
    backupCommand(io),
  ]) {
    command
      .exitOverride()
      .configureOutput({ writeOut: (text) => io.out(text), writeErr: (text) => io.err(text) });
    command.showHelpAfterError('(run with --help for usage)');
    program.addCommand(command);
  }
  return program;
}
