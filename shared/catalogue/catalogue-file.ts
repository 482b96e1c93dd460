/** The catalogue's name, which no formula may take as its id. */
export const CATALOGUE_ID = 'catalogue';

/** The catalogue's file name, at the top of the formulas folder. */
export const CATALOGUE_FILE = `${CATALOGUE_ID}.yaml`;

/**
 * Whether a file name (with or without its folder) is the catalogue of materials: exactly
 * catalogue.yaml, the one name the catalogue is looked for by (any other is read as a formula,
 * and its problems say so, rather than being passed over unread).
 */
export function isCatalogueFile(name: string): boolean {
  return name.split(/[\\/]/).pop() === CATALOGUE_FILE;
}

/** Whether a file name is a formula file: *.yaml or *.yml, and not the catalogue. */
export function isFormulaFileName(name: string): boolean {
  return /\.ya?ml$/i.test(name) && !isCatalogueFile(name);
}
