import type { Request } from 'express';
import { contentError } from '../../shared/formula/formula-problem.ts';
import { placeProblems } from '../../shared/index.ts';
import type { FormulaFile } from './formula-files.ts';

/**
 * The site formulas are read for: the request's site and every site key of the install (a
 * formula naming a key that is none of them is an error of its file).
 */
export interface FormulaSite {
  readonly key: string;
  readonly known: readonly string[];
}

/**
 * The formula site of a signed-in request (after resolveSite), or undefined when the request has
 * no site: then every formula is read, as the demo's seed and the command line read them.
 */
export function formulaSiteOf(req: Request): FormulaSite | undefined {
  if (!req.site || !req.installSiteKeys) return undefined;
  return { key: req.site.key, known: req.installSiteKeys };
}

/**
 * The files a site sees: a formula with `site:` of another site is left out, as if it did not
 * exist; one whose `site:` is no site of the install loses its formula and gets an error at that
 * key, so that it shows in the list the way any other broken file does. Formulas without the key
 * are the group's. Without a site, the files as they are.
 */
export function filesAtSite(
  files: readonly FormulaFile[],
  at: FormulaSite | undefined,
): FormulaFile[] {
  // Most folders name no site: nothing to copy or check then.
  if (!at || files.every((file) => file.reading.formula?.site === undefined)) return [...files];
  return files.flatMap((file) => {
    const site = file.reading.formula?.site;
    if (site === undefined) return [file];
    if (!at.known.includes(site)) return [withUnknownSite(file, site, at.known)];
    return site === at.key ? [file] : [];
  });
}

/** The file with its formula taken away and an error at its `site:` key. */
function withUnknownSite(file: FormulaFile, site: string, known: readonly string[]): FormulaFile {
  const [problem] = placeProblems(file.text, file.name, [
    contentError(['site'], `no site "${site}" in this install (its sites: ${known.join(', ')})`),
  ]);
  const problems = [...file.reading.problems, problem].sort(
    (a, b) => a.line - b.line || a.column - b.column,
  );
  return { ...file, reading: { problems } };
}
