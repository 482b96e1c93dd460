import { readFile } from 'node:fs/promises';
import path from 'node:path';
import {
  CATALOGUE_FILE,
  planStock,
  readCatalogue,
  type CatalogueReading,
  type Formula,
  type PlanResult,
  type PlanStock,
  type UnitSystem,
} from '../../shared/index.ts';
import type { Database } from '../db/database.ts';
import { readStockOnHand } from './stock-on-hand.ts';
import type { SiteScope } from '../sites/site-scope.ts';

/**
 * The catalogue of materials beside a formulas folder, read; undefined when there is none (the
 * kitchen has not set it up).
 */
export async function catalogueBeside(folder: string): Promise<CatalogueReading | undefined> {
  const file = path.join(folder, CATALOGUE_FILE);
  try {
    return readCatalogue(await readFile(file, 'utf8'), CATALOGUE_FILE);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return undefined;
    throw error;
  }
}

/**
 * A plan's pull list against the lots on hand in these records, or why it cannot be compared:
 * no catalogue to link the formulas' lines to the lots, a catalogue with errors, or no delivery
 * recorded yet.
 * @param formulas the formulas the plan was made from, by id
 */
export async function comparePlanWithStock(
  db: Database,
  plan: PlanResult,
  formulas: ReadonlyMap<string, Formula>,
  catalogue: CatalogueReading | undefined,
  units: UnitSystem,
  site?: SiteScope,
): Promise<PlanStock> {
  if (!catalogue) {
    return {
      compared: false,
      reason:
        'There is no catalogue of materials beside the formulas, so the pull list cannot be matched to the lots received.',
    };
  }
  if (!catalogue.catalogue) {
    return {
      compared: false,
      reason:
        'The catalogue of materials has errors, so the pull list cannot be matched to the lots received: put it right first.',
    };
  }
  const stock = await readStockOnHand(db, site);
  if (!stock) {
    return {
      compared: false,
      reason:
        'No deliveries have been recorded yet, so there is no stock to compare the pull list with.',
    };
  }
  return planStock(plan, formulas, catalogue.catalogue, stock, units);
}
