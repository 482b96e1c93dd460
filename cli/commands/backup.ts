import { Command } from 'commander';
import { EXIT_CODES_HELP } from '../cli-error.ts';
import type { Io } from '../io.ts';

/** `larder backup FILE`: a consistent copy of this machine's database, taken while it runs. */
export function backupCommand(io: Io): Command {
  return new Command('backup')
    .description(
      "copy this machine's Larderbook database to a new file, safely while the server runs",
    )
    .argument('<file>', 'the backup file to write; it must not exist yet')
    .option('--json', 'print what was written as JSON')
    .addHelpText(
      'after',
      `\nThe database is found as the server finds it (LARDER_DATA, LARDER_DB). The formula files\nare not in it: keep them in git (or copy the formulas folder) as well.\n\nExample:\n  larder backup /var/backups/larderbook/$(date +%F).sqlite\n${EXIT_CODES_HELP}`,
    )
    .action(async (file: string, options: { json?: boolean }) => {
      const { backupDatabase } = await import('../local/backup-local.ts');
      const summary = await backupDatabase(file);
      io.out(
        options.json
          ? `${JSON.stringify(summary, null, 2)}\n`
          : `Backed up ${summary.from} to ${summary.file}: ${summary.batches} batches, ${summary.people} people, ${(summary.bytes / 1024).toFixed(0)} KB, checked whole.\n`,
      );
    });
}
