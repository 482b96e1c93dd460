/** The catalogue's name, which no formula may take as its id. */
export const CATALOGUE_ID = 'catalogue';

/** The catalogue's file name, at the top of the formulas folder. */
export const CATALOGUE_FILE = `${CATALOGUE_ID}.yaml`;

/** Whether a file name (with or without its folder) is the catalogue of materials. */
export function isCatalogueFile(name: string): boolean {
  return (name.split(/[\\/]/).pop() ?? '').toLowerCase() === CATALOGUE_FILE;
}

/** Whether a file name is a formula file: *.yaml or *.yml, and not the catalogue. */
export function isFormulaFileName(name: string): boolean {
  return /\.ya?ml$/i.test(name) && !isCatalogueFile(name);
}
