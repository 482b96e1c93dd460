import { Command, Option } from 'commander';
import { CliError, EXIT, EXIT_CODES_HELP } from '../cli-error.ts';
import type { Io } from '../io.ts';
import { textTable } from '../output/text-table.ts';

interface AddOptions {
  name?: string;
  role: 'admin' | 'cook' | 'reviewer';
  email?: string;
  site?: string;
  json?: boolean;
}

/** `larder users`: people in this machine's database (the first admin is made here). */
export function usersCommand(io: Io): Command {
  const users = new Command('users').description(
    "manage people in this machine's Larderbook database",
  );

  users
    .command('add')
    .description(
      'add a person; the password is typed (or read from stdin, or $LARDER_NEW_PASSWORD)',
    )
    .argument('<username>', 'sign-in name: lower-case letters, digits, dot, dash, underscore')
    .option('--name <display name>', 'name shown in the console (default: the username)')
    .addOption(
      new Option('--role <role>', 'admin, cook or reviewer')
        .choices(['admin', 'cook', 'reviewer'])
        .makeOptionMandatory(),
    )
    .option('--email <address>', 'e-mail address')
    .option('--site <key>', 'the role holds at this site only (default: at every site)')
    .option('--json', 'print the person as JSON')
    .addHelpText(
      'after',
      `\nExamples:\n  larder users add rosa --name "Rosa Quennick" --role admin\n  echo "$PASSWORD" | larder users add tobin --role cook\n  larder users add pell --role cook --site saltmarrow\n${EXIT_CODES_HELP}`,
    )
    .action(async (username: string, options: AddOptions) => {
      if (!/^[a-z][a-z0-9._-]{1,31}$/.test(username)) {
        throw new CliError(
          'the username may hold lower-case letters, digits, dot, dash and underscore, starting with a letter',
          EXIT.usage,
        );
      }
      const { addUser } = await import('../local/users-local.ts');
      const person = await addUser({
        username,
        displayName: options.name ?? username,
        role: options.role,
        email: options.email,
        site: options.site,
      });
      const where = options.site === undefined ? '' : ` at ${options.site} only`;
      io.out(
        options.json
          ? `${JSON.stringify(person, null, 2)}\n`
          : `Added ${person.username} (${person.role}${where}).\n`,
      );
    });

  users
    .command('list')
    .description('list everyone')
    .option('--json', 'print as JSON')
    .action(async (options: { json?: boolean }) => {
      const { listUsers } = await import('../local/users-local.ts');
      const people = await listUsers();
      if (options.json) return io.out(`${JSON.stringify(people, null, 2)}\n`);
      const rows = people.map((p) => [
        p.username,
        p.displayName,
        p.role,
        p.active ? 'active' : 'inactive',
        p.demo ? 'demo' : '',
      ]);
      io.out(
        `${textTable([['username', 'name', 'role', 'status', ''], ...rows], ['left', 'left', 'left', 'left', 'left']).join('\n')}\n`,
      );
    });

  users
    .command('set-password')
    .description("set a person's password (for a locked-out admin)")
    .argument('<username>')
    .action(async (username: string) => {
      const { setUserPassword } = await import('../local/users-local.ts');
      await setUserPassword(username);
      io.out(`Password set for ${username}.\n`);
    });

  for (const command of users.commands)
    command
      .exitOverride()
      .configureOutput({ writeOut: (t) => io.out(t), writeErr: (t) => io.err(t) });
  return users;
}
