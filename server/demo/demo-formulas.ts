import { cpSync, existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** The demo formulas shipped in the checkout (formulas/), found from this module's place in dist/ or server/. */
export const SHIPPED_FORMULAS = path.resolve(
  path.dirname(fileURLToPath(import.meta.url)),
  '..',
  '..',
  'formulas',
);

/**
 * Gives the demo its own copy of the shipped formulas on first start, so edits made in the demo
 * console change the copy and never the checkout.
 */
export function ensureDemoFormulas(formulasDir: string, source = SHIPPED_FORMULAS): void {
  if (existsSync(formulasDir) || path.resolve(formulasDir) === path.resolve(source)) return;
  cpSync(source, formulasDir, {
    recursive: true,
    filter: (file) => !path.basename(file).startsWith('.'),
  });
}
