import { readFile, stat } from 'node:fs/promises';
import path from 'node:path';
import { CATALOGUE_FILE } from '../../shared/catalogue/catalogue-file.ts';
import type { CatalogueItem } from '../../shared/catalogue/catalogue-types.ts';
import { readCatalogue } from '../../shared/catalogue/read-catalogue.ts';
import { AppError } from '../http/app-error.ts';

/**
 * The catalogue of materials (catalogue.yaml beside the formulas) as the receiving door reads
 * it: read again whenever the file changes on disk, so an item added in an editor or by a git
 * pull can be received at once.
 */
export class CatalogueItems {
  // The catalogue as last read, by the file's modification time: requests that arrive together
  // share one read.
  private cached:
    { mtimeMs: number; items: Promise<ReadonlyMap<string, CatalogueItem>> } | undefined;

  constructor(private readonly folder: string) {}

  private get file(): string {
    return path.join(this.folder, CATALOGUE_FILE);
  }

  /**
   * Every item by key; empty when the kitchen has no catalogue yet.
   * @throws AppError 409 'catalogue-broken' when the file has errors (`larder check` names them)
   */
  async items(): Promise<ReadonlyMap<string, CatalogueItem>> {
    let mtimeMs: number;
    try {
      mtimeMs = (await stat(this.file)).mtimeMs;
    } catch {
      return new Map();
    }
    if (this.cached?.mtimeMs !== mtimeMs) {
      const items = this.read();
      this.cached = { mtimeMs, items };
      // A failed read is not kept: the next request reads the file again.
      items.catch(() => {
        if (this.cached?.items === items) this.cached = undefined;
      });
    }
    return this.cached.items;
  }

  private async read(): Promise<ReadonlyMap<string, CatalogueItem>> {
    const reading = readCatalogue(await readFile(this.file, 'utf8'), CATALOGUE_FILE);
    if (!reading.catalogue)
      throw new AppError(
        409,
        'catalogue-broken',
        `the catalogue of materials (${CATALOGUE_FILE}) has errors: check the formulas to see them`,
      );
    return new Map(reading.catalogue.items.map((item) => [item.key, item]));
  }

  /**
   * One item by key.
   * @throws AppError 422 'unknown-item' when the catalogue has no such item
   */
  async item(key: string): Promise<CatalogueItem> {
    const found = (await this.items()).get(key);
    if (!found)
      throw new AppError(422, 'unknown-item', `"${key}" is not in the catalogue of materials`, [
        { field: 'item', message: 'is not in the catalogue' },
      ]);
    return found;
  }
}
