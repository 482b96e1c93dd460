// The catalogue of materials in `larder check`: which catalogue each formula file is checked
// against, reading it, and the formulas' problems against it.
import { readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import {
  CATALOGUE_FILE,
  checkCatalogue,
  type CatalogueReading,
  type FormulaReading,
} from '../shared/index.ts';

/** A formula file read, and the catalogue file it is checked against. */
export interface CatalogueTarget {
  readonly file: string;
  readonly reading: FormulaReading;
  /** The catalogue.yaml of the folder named on the command line, or beside a file named alone. */
  readonly catalogue: string;
}

/** The catalogue a folder's formulas are checked against: catalogue.yaml at its top. */
export function catalogueIn(folder: string): string {
  return path.join(folder, CATALOGUE_FILE);
}

/** The text of a catalogue file; undefined when there is none (the kitchen has not set it up). */
export function catalogueText(file: string): string | undefined {
  // One file, read whole: the reader refuses it by its size as it would a formula.
  return statSync(file, { throwIfNoEntry: false })?.isFile()
    ? readFileSync(file, 'utf8')
    : undefined;
}

/**
 * The readings with each formula checked against its catalogue (checkCatalogue). A formula whose
 * catalogue is missing, or has errors of its own, is left as it was: no catalogue, no warnings.
 */
export function withCatalogueChecks(
  targets: readonly CatalogueTarget[],
  catalogues: ReadonlyMap<string, CatalogueReading>,
  textOf: (file: string) => string,
): FormulaReading[] {
  return targets.map((target) => {
    const reading = catalogues.get(target.catalogue);
    if (!reading?.catalogue) return target.reading;
    const linked = { catalogue: reading.catalogue, places: reading.places, file: target.catalogue };
    return checkCatalogue([target], textOf, linked)[0];
  });
}
