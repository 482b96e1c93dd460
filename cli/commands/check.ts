import { execFileSync } from 'node:child_process';
import { readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { Command } from 'commander';
import {
  CATALOGUE_FILE,
  checkLibrary,
  formatProblem,
  isCatalogueFile,
  readCatalogue,
  readFormula,
  type CatalogueReading,
  type FormulaProblem,
  type FormulaReading,
} from '../../shared/index.ts';
import {
  catalogueIn,
  catalogueText,
  withCatalogueChecks,
  type CatalogueTarget,
} from '../check-catalogue.ts';
import { readFormulaFilesOnThreads } from '../check-pool.ts';
import { checkThreads, threadsSetting } from '../check-threads.ts';
import { CliError, EXIT, EXIT_CODES_HELP } from '../cli-error.ts';
import { formulaFilesIn, formulasFolder, isFormulaFile } from '../formula-files.ts';
import type { Io } from '../io.ts';

interface CheckOptions {
  staged?: boolean;
  json?: boolean;
}

/** One file's outcome. */
interface FileReport {
  file: string;
  id?: string;
  kind?: string;
  ok: boolean;
  problems: FormulaProblem[];
}

/** Draw progress when there are this many files or more, and the terminal can show it. */
const PROGRESS_FROM = 50;

/** `larder check [PATHS…]`: validate formula files; with --staged, the files staged in git. */
export function checkCommand(io: Io): Command {
  return new Command('check')
    .description(
      'check formula files: YAML, schema, percentages and nitrite limits; a folder also checks its assemblies against the formulas they name, and every formula against its catalogue of materials (catalogue.yaml)',
    )
    .argument('[paths...]', 'files or folders to check (default: $LARDER_FORMULAS or ./formulas)')
    .option('--staged', 'check the formula files staged in git, as staged (for a pre-commit hook)')
    .option('--json', 'print the report as JSON')
    .addHelpText(
      'after',
      `
Examples:
  larder check                      every formula under ./formulas
  larder check formulas/ham-pump.yaml  one file
  larder check formulas/catalogue.yaml  the catalogue of materials alone
  larder check --staged             in .git/hooks/pre-commit: refuse a commit with a bad formula

Environment:
  LARDER_CHECK_THREADS=N  threads to read files on; by default one per CPU (at most 8) from
                          1000 files on, else 1, which reads every file on the main thread
${EXIT_CODES_HELP}`,
    )
    .action((paths: string[], options: CheckOptions) => runCheck(paths, options, io));
}

/** What was read: the formula files with the catalogue each is checked against, and the catalogues. */
interface Checked {
  readonly formulas: CatalogueTarget[];
  /** Each catalogue file there is, read, by its name; a missing one is not here. */
  readonly catalogues: Map<string, CatalogueReading>;
  /** The text of a formula file as it was checked. */
  readonly textOf: (file: string) => string;
}

async function runCheck(paths: string[], options: CheckOptions, io: Io): Promise<void> {
  const threads = threadsSetting();
  const targets = paths.length ? paths : [formulasFolder()];
  const checked = options.staged ? readStaged() : await readPaths(targets, threads, io);
  let readings = checked.formulas.map(({ file, reading }) => ({ file, reading }));
  // A folder is a library: each assembly in it must name formulas that are there and fit.
  // Single files and --staged are checked on their own.
  if (!options.staged && targets.some(isFolder)) readings = withLibraryChecks(readings);
  const linked = withCatalogueChecks(
    checked.formulas.map((target, i) => ({ ...target, reading: readings[i].reading })),
    checked.catalogues,
    checked.textOf,
  );
  const catalogueReports = [...checked.catalogues].map(([file, reading]): FileReport => ({
    file,
    kind: 'catalogue',
    ok: reading.catalogue !== undefined,
    problems: [...reading.problems],
  }));
  const reports = [
    ...catalogueReports,
    ...checked.formulas.map(({ file }, i): FileReport => ({
      file,
      id: linked[i].formula?.id,
      kind: linked[i].formula?.kind,
      ok: !linked[i].problems.some((p) => p.severity === 'error'),
      problems: [...linked[i].problems],
    })),
  ];
  markDuplicateIds(reports);
  const failed = reports.filter((r) => !r.ok).length;
  const warnings = reports.reduce(
    (n, r) => n + r.problems.filter((p) => p.severity === 'warning').length,
    0,
  );
  const summary = { files: reports.length, ok: reports.length - failed, failed, warnings };
  if (options.json) {
    io.out(`${JSON.stringify({ summary, files: reports }, null, 2)}\n`);
  } else {
    for (const report of reports)
      for (const problem of report.problems) io.out(`${formatProblem(problem)}\n`);
    io.out(
      `Checked ${checkedWhat(checked.formulas.length, catalogueReports.length)}: ${summary.ok} ok, ${summary.failed} with errors, ${summary.warnings} warning(s).\n`,
    );
  }
  if (failed > 0) process.exitCode = EXIT.formula;
}

/** "11 formula file(s) and the catalogue", "the catalogue", as the summary says it. */
function checkedWhat(formulas: number, catalogues: number): string {
  const what = catalogues === 1 ? 'the catalogue' : `${catalogues} catalogues`;
  if (catalogues === 0) return `${formulas} formula file(s)`;
  return formulas === 0 ? what : `${formulas} formula file(s) and ${what}`;
}

async function readPaths(paths: string[], threads: number | undefined, io: Io): Promise<Checked> {
  const files: { file: string; catalogue: string }[] = [];
  const named: string[] = [];
  for (const target of paths) {
    let isFolder: boolean;
    try {
      isFolder = statSync(target).isDirectory();
    } catch {
      throw new CliError(`${target}: no such file or folder`, EXIT.formula);
    }
    if (isFolder) {
      const catalogue = catalogueIn(target);
      files.push(...formulaFilesIn(target).map((file) => ({ file, catalogue })));
    } else if (isCatalogueFile(target)) named.push(target);
    else files.push({ file: target, catalogue: catalogueIn(path.dirname(target)) });
  }
  if (files.length === 0 && named.length === 0)
    throw new CliError(`no formula files (*.yaml, *.yml) in ${paths.join(', ')}`, EXIT.formula);
  // The same file named twice (a file and its folder) is checked once.
  const unique = [...new Map(files.map((f) => [path.resolve(f.file), f])).values()];
  const showProgress = io.errIsTty && unique.length >= PROGRESS_FROM;
  if (showProgress) io.err(`checking 0/${unique.length}`);
  const readings = await readFormulaFilesOnThreads(
    unique.map((f) => f.file),
    {
      threads: checkThreads(unique.length, threads),
      onProgress: showProgress
        ? (done) => io.err(`\rchecking ${done}/${unique.length}`)
        : undefined,
      // Only a bug or a lack of memory stops a worker; the report is whole all the same.
      onWorkerFailure: (reason) =>
        io.err(
          `${showProgress ? '\n' : ''}larder: a checking thread stopped (${reason}); the other threads checked its files\n`,
        ),
    },
  );
  if (showProgress) io.err('\n');
  const catalogues = new Map<string, CatalogueReading>();
  for (const file of [...named, ...unique.map((f) => f.catalogue)]) {
    const text = catalogues.has(file) ? undefined : catalogueText(file);
    if (text !== undefined) catalogues.set(file, readCatalogue(text, file));
  }
  return {
    formulas: unique.map((f, i) => ({ ...f, reading: readings[i] })),
    catalogues,
    textOf: (file) => readFileSync(file, 'utf8'),
  };
}

function isFolder(target: string): boolean {
  try {
    return statSync(target).isDirectory();
  } catch {
    return false;
  }
}

/** The readings with each assembly checked against the other formulas read with it. */
function withLibraryChecks(
  readings: { file: string; reading: FormulaReading }[],
): { file: string; reading: FormulaReading }[] {
  const checked = checkLibrary(readings, (file) => readFileSync(file, 'utf8'));
  return readings.map(({ file }, i) => ({ file, reading: checked[i] }));
}

function git(args: string[]): string {
  try {
    return execFileSync('git', args, {
      encoding: 'utf8',
      stdio: ['ignore', 'pipe', 'pipe'],
      maxBuffer: 64 * 1024 * 1024,
    });
  } catch (error) {
    const stderr = String((error as { stderr?: unknown }).stderr ?? '').trim();
    throw new CliError(`--staged needs a git repository: ${stderr || String(error)}`, EXIT.usage);
  }
}

function readStaged(): Checked {
  // Outside a repository git diff falls back to comparing files; ask first, to fail plainly.
  try {
    execFileSync('git', ['rev-parse', '--is-inside-work-tree'], { stdio: 'ignore' });
  } catch {
    throw new CliError(
      '--staged needs a git repository, and this folder is not in one',
      EXIT.usage,
    );
  }
  const names = git(['diff', '--cached', '--name-only', '--diff-filter=ACMR', '-z'])
    .split('\0')
    .filter(Boolean);
  // Check what is staged, not what is in the working tree: that is what the commit will hold.
  const textOf = (file: string): string => git(['show', `:${file}`]);
  const formulas = names.filter(isFormulaFile).map((file) => ({
    file,
    reading: readFormula(textOf(file), file),
    catalogue: path.posix.join(path.posix.dirname(file), CATALOGUE_FILE),
  }));
  const catalogues = new Map<string, CatalogueReading>();
  for (const file of [...names.filter(isCatalogueFile), ...formulas.map((f) => f.catalogue)]) {
    if (catalogues.has(file) || !staged(file)) continue;
    catalogues.set(file, readCatalogue(textOf(file), file));
  }
  return { formulas, catalogues, textOf };
}

/** Whether a file is in git's index (staged now or committed before). */
function staged(file: string): boolean {
  try {
    execFileSync('git', ['cat-file', '-e', `:${file}`], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

function markDuplicateIds(reports: FileReport[]): void {
  const firstFile = new Map<string, string>();
  for (const report of reports) {
    if (!report.id) continue;
    const first = firstFile.get(report.id);
    if (first === undefined) {
      firstFile.set(report.id, report.file);
      continue;
    }
    report.ok = false;
    report.problems.push({
      file: report.file,
      line: 0,
      column: 0,
      path: ['id'],
      severity: 'error',
      message: `the id "${report.id}" is already used by ${first}; every formula needs its own id`,
    });
  }
}
