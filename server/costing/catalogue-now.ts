import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { CATALOGUE_FILE } from '../../shared/catalogue/catalogue-file.ts';
import type { Catalogue } from '../../shared/catalogue/catalogue-types.ts';
import { readCatalogue } from '../../shared/catalogue/read-catalogue.ts';

/**
 * The catalogue of materials beside the formulas, as it is on disk now; undefined when there is
 * none or it has errors (costing then prices only what lots were recorded for).
 */
export async function catalogueNow(folder: string): Promise<Catalogue | undefined> {
  let text: string;
  try {
    text = await readFile(path.join(folder, CATALOGUE_FILE), 'utf8');
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return undefined;
    throw error;
  }
  return readCatalogue(text, CATALOGUE_FILE).catalogue;
}
