import assert from 'node:assert/strict';
import {
  mkdirSync,
  mkdtempSync,
  readFileSync,
  renameSync,
  rmSync,
  symlinkSync,
  writeFileSync,
} from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, it, type TestContext } from 'node:test';
import { setTimeout as delay } from 'node:timers/promises';
import { FormulaStore } from './formula-store.ts';

const SAUCE = readFileSync(
  path.join(import.meta.dirname, '../../formulas/house-sauce.yaml'),
  'utf8',
);

/** The sauce under another title, so that a test can tell which text was read. */
function sauceTitled(title: string): string {
  return SAUCE.replace(/^title: .*$/m, `title: ${title}`);
}

/** A watching store on a fresh folder holding the sauce; closed and removed after the test. */
function watchedStore(t: TestContext): { store: FormulaStore; dir: string; folder: string } {
  const dir = mkdtempSync(path.join(tmpdir(), 'larder-store-'));
  const folder = path.join(dir, 'formulas');
  mkdirSync(folder);
  writeFileSync(path.join(folder, 'house-sauce.yaml'), sauceTitled('First'));
  const store = new FormulaStore(folder, { watch: true });
  t.after(() => {
    store.close();
    rmSync(dir, { recursive: true, force: true });
  });
  return { store, dir, folder };
}

async function title(store: FormulaStore): Promise<string | undefined> {
  return (await store.current('house-sauce')).formula.title;
}

// The system tells of a change within milliseconds; a generous wait keeps a busy machine green.
const NOTICE_MS = 200;

describe('FormulaStore watching its folder', () => {
  it('should read a file edited on disk once the change is told, and keep the last read meanwhile', async (t) => {
    const { store, folder } = watchedStore(t);
    assert.equal(await title(store), 'First');
    const first = await store.files();
    assert.equal(await title(store), 'First'); // the watch is in place from here on
    assert.equal((await store.files())[0], first[0], 'an unchanged folder is not read again');
    writeFileSync(path.join(folder, 'house-sauce.yaml'), sauceTitled('Second'));
    await delay(NOTICE_MS);
    assert.equal(await title(store), 'Second');
  });

  it('should answer at once only while nothing has changed, and leave a change to be read', async (t) => {
    const { store, folder } = watchedStore(t);
    assert.equal(store.currentNow('house-sauce'), undefined, 'not read yet');
    assert.equal(await title(store), 'First');
    assert.equal(await title(store), 'First'); // the watch is in place from here on
    assert.equal(store.currentNow('house-sauce')?.formula.title, 'First');
    assert.throws(() => store.currentNow('no-such'), /no formula "no-such"/);

    writeFileSync(path.join(folder, 'house-sauce.yaml'), sauceTitled('Second'));
    await delay(NOTICE_MS);
    assert.equal(store.currentNow('house-sauce'), undefined, 'a change told: read first');
    assert.equal(store.currentNow('house-sauce'), undefined, 'still, until it is read');
    assert.equal(await title(store), 'Second');
    assert.equal(store.currentNow('house-sauce')?.formula.title, 'Second');
  });

  it('should see a file added, replaced by a rename, and deleted', async (t) => {
    const { store, folder } = watchedStore(t);
    await store.files();
    await store.files();
    writeFileSync(path.join(folder, 'pit-sauce.yaml'), SAUCE.replace(/^id: .*$/m, 'id: pit-sauce'));
    await delay(NOTICE_MS);
    assert.ok(await store.find('pit-sauce'));
    writeFileSync(path.join(folder, 'next.tmp'), sauceTitled('Renamed in'));
    renameSync(path.join(folder, 'next.tmp'), path.join(folder, 'house-sauce.yaml'));
    await delay(NOTICE_MS);
    assert.equal(await title(store), 'Renamed in');
    rmSync(path.join(folder, 'pit-sauce.yaml'));
    await delay(NOTICE_MS);
    assert.equal(await store.find('pit-sauce'), undefined);
  });

  it('should answer 503 while the folder is gone, and read it again once it is back', async (t) => {
    const { store, folder } = watchedStore(t);
    await store.files();
    await store.files();
    rmSync(folder, { recursive: true });
    await delay(NOTICE_MS);
    await assert.rejects(store.files(), { status: 503, code: 'formulas-unavailable' });
    mkdirSync(folder);
    writeFileSync(path.join(folder, 'house-sauce.yaml'), sauceTitled('Restored'));
    assert.equal(await title(store), 'Restored');
    writeFileSync(path.join(folder, 'house-sauce.yaml'), sauceTitled('Edited after'));
    await delay(NOTICE_MS);
    assert.equal(await title(store), 'Edited after', 'the new folder is watched, not the old one');
  });

  it('should read a linked file every time, since its target changes out of sight', async (t) => {
    const { store, dir, folder } = watchedStore(t);
    const elsewhere = path.join(dir, 'kept-elsewhere.yaml');
    writeFileSync(elsewhere, SAUCE.replace(/^id: .*$/m, 'id: linked-sauce'));
    symlinkSync(elsewhere, path.join(folder, 'linked-sauce.yaml'));
    await store.files();
    await store.files();
    writeFileSync(
      elsewhere,
      SAUCE.replace(/^id: .*$/m, 'id: linked-sauce').replace(/^title: .*$/m, 'title: Via link'),
    );
    // No wait: nothing in the watched folder changed, so only a fresh read can see this.
    assert.equal((await store.current('linked-sauce')).formula.title, 'Via link');
  });

  it('should see a change made by a save here at once, before any notice', async (t) => {
    const { store, folder } = watchedStore(t);
    await store.files();
    await store.files();
    writeFileSync(path.join(folder, 'house-sauce.yaml'), sauceTitled('Saved here'));
    store.changed();
    assert.equal(await title(store), 'Saved here');
  });
});
