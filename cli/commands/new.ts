import { existsSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Command, Option } from 'commander';
import {
  formatProblem,
  isFormulaId,
  readFormula,
  starterFormula,
  type CureMethod,
  type FormulaKind,
} from '../../shared/index.ts';
import { CliError, EXIT, EXIT_CODES_HELP } from '../cli-error.ts';
import type { Io } from '../io.ts';

interface NewOptions {
  id?: string;
  title?: string;
  method?: CureMethod;
  out?: string;
  force?: boolean;
  json?: boolean;
}

/** The schema file shipped with larder, for the editor hint at the top of a new file. */
function schemaFile(): string {
  // The command runs from dist/cli/ in the package; the schema lives in shared/schema/.
  const here = path.dirname(fileURLToPath(import.meta.url));
  return path.resolve(here, '..', '..', 'shared', 'schema', 'formula.schema.json');
}

/** `larder new KIND`: write a commented starter formula. */
export function newCommand(io: Io): Command {
  return new Command('new')
    .description('write a commented starter formula file')
    .addArgument(
      new Command()
        .createArgument('<kind>', 'cure, dough, blend or mix')
        .choices(['cure', 'dough', 'blend', 'mix']),
    )
    .option('--id <id>', 'formula id: lower-case letters, digits and dashes (default: new-KIND)')
    .option('--title <title>', 'title printed on the batch sheet')
    .addOption(
      new Option('--method <method>', 'cure only: dry, brine or pump (default: dry)').choices([
        'dry',
        'brine',
        'pump',
      ]),
    )
    .option('--out <file>', 'where to write it, or - for standard output (default: ID.yaml here)')
    .option('--force', 'overwrite an existing file')
    .option('--json', 'print what was written as JSON')
    .addHelpText(
      'after',
      `
Examples:
  larder new cure --id smoked-jowl --title "Smoked jowl" --out formulas/smoked-jowl.yaml
  larder new cure --method pump --id ham-pump
  larder new dough --out -
${EXIT_CODES_HELP}`,
    )
    .action((kind: FormulaKind, options: NewOptions) => runNew(kind, options, io));
}

function runNew(kind: FormulaKind, options: NewOptions, io: Io): void {
  const id = options.id ?? `new-${kind}`;
  if (!isFormulaId(id)) {
    throw new CliError(
      `--id "${id}" may hold only lower-case letters, digits and dashes, 2 to 63 characters`,
      EXIT.usage,
    );
  }
  if (options.method && kind !== 'cure')
    throw new CliError('--method applies only to cure formulas', EXIT.usage);
  const out = options.out ?? `${id}.yaml`;
  const schemaPath =
    out === '-' ? schemaFile() : path.relative(path.dirname(path.resolve(out)), schemaFile());
  const text = starterFormula(kind, {
    id,
    title: options.title ?? `New ${kind} formula`,
    method: options.method ?? 'dry',
    schemaPath,
  });
  // The starter must itself pass the checks; a bad --id or --title shows here, before anything is written.
  const reading = readFormula(text, out);
  if (!reading.formula)
    throw new CliError(
      'the starter would not be a valid formula',
      EXIT.usage,
      reading.problems.map(formatProblem),
    );
  if (out === '-') {
    io.out(text);
    return;
  }
  writeAtomically(out, text, options.force ?? false);
  io.out(
    options.json
      ? `${JSON.stringify({ file: out, id, kind })}\n`
      : `Wrote ${out} (${kind}). Edit it, then run: larder check ${out}\n`,
  );
}

/** Writes beside the target and renames, so an interrupted write never leaves half a file. */
function writeAtomically(out: string, text: string, force: boolean): void {
  const folder = path.dirname(path.resolve(out));
  if (!existsSync(folder))
    throw new CliError(`the folder ${path.dirname(out)} does not exist`, EXIT.usage);
  if (existsSync(out)) {
    if (statSync(out).isDirectory())
      throw new CliError(`${out} is a folder; give a file name with --out`, EXIT.usage);
    if (!force)
      throw new CliError(`${out} already exists; choose another --out or add --force`, EXIT.usage);
  }
  const temporary = `${out}.${process.pid}.tmp`;
  try {
    writeFileSync(temporary, text, { flag: 'wx' });
    renameSync(temporary, out);
  } catch (error) {
    // A full disk or a permission problem: report it plainly and leave nothing behind.
    rmSync(temporary, { force: true });
    throw new CliError(`could not write ${out}: ${(error as Error).message}`, EXIT.usage);
  }
}
