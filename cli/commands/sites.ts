import { Command } from 'commander';
import { EXIT_CODES_HELP } from '../cli-error.ts';
import type { Io } from '../io.ts';
import { textTable } from '../output/text-table.ts';

/** A site as the command prints it. */
interface SiteLine {
  readonly key: string;
  readonly name: string;
}

/** `larder sites`: the kitchens of the group in this machine's records; `add` makes one. */
export function sitesCommand(io: Io): Command {
  const sites = new Command('sites')
    .description("the sites (kitchens) of the group in this machine's Larderbook database")
    .option('--json', 'print as JSON')
    .addHelpText(
      'after',
      `\nExamples:\n  larder sites\n  larder sites add harbour --name "Harbour Street shop"\n${EXIT_CODES_HELP}`,
    )
    .action(async (options: { json?: boolean }) => {
      const { listSitesHere } = await import('../local/sites-local.ts');
      const all: SiteLine[] = (await listSitesHere()).map(({ key, name }) => ({ key, name }));
      if (options.json) return io.out(`${JSON.stringify({ sites: all }, null, 2)}\n`);
      const rows = all.map((site) => [site.key, site.name]);
      io.out(`${textTable([['key', 'name'], ...rows], ['left', 'left']).join('\n')}\n`);
    });

  sites
    .command('add')
    .description('add a site; its key is lower-case letters, digits and dashes')
    .argument('<key>', 'short name of the site, e.g. harbour')
    .requiredOption('--name <name>', 'the name people read, e.g. "Harbour Street shop"')
    .option('--json', 'print the site as JSON')
    .action(async (key: string, options: { name: string; json?: boolean }) => {
      const { addSiteHere } = await import('../local/sites-local.ts');
      const site = await addSiteHere(key, options.name);
      io.out(
        options.json
          ? `${JSON.stringify({ key: site.key, name: site.name }, null, 2)}\n`
          : `Added the site ${site.name} (${site.key}).\n`,
      );
    });

  return sites;
}
