import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, it } from 'node:test';
import { postscriptName, sfntOfWoff } from './woff-font.ts';

const require = createRequire(import.meta.url);
const woff = (key: string): Buffer =>
  readFileSync(require.resolve(`@fontsource/fira-sans/files/fira-sans-${key}-normal.woff`));

/**
 * A table's checksum: its bytes as big-endian 32-bit words, zero-padded, summed modulo 2^32; the
 * head table's with its checkSumAdjustment (bytes 8–11) taken as 0.
 * source: Microsoft, OpenType specification 1.9, "The OpenType font file", Calculating checksums;
 * "head" table, checksumAdjustment
 */
function checksum(table: Buffer, isHead: boolean): number {
  const padded = Buffer.alloc((table.length + 3) & ~3);
  table.copy(padded);
  if (isHead) padded.writeUInt32BE(0, 8);
  let sum = 0;
  for (let i = 0; i < padded.length; i += 4) sum = (sum + padded.readUInt32BE(i)) >>> 0;
  return sum;
}

describe('a WOFF font unwrapped into the OpenType font inside it', () => {
  for (const key of ['latin-400', 'latin-ext-600']) {
    it(`should give every table of ${key} back whole, each matching the checksum the file records`, () => {
      const source = woff(key);
      const font = sfntOfWoff(source);
      // source: OpenType 1.9, table directory: sfntVersion, numTables, then 16-byte records
      assert.equal(font.readUInt32BE(0), source.readUInt32BE(4));
      const count = font.readUInt16BE(4);
      assert.equal(count, source.readUInt16BE(12));
      // source: OpenType 1.9: searchRange is the largest power of two ≤ numTables, times 16
      const power = 2 ** Math.floor(Math.log2(count));
      assert.equal(font.readUInt16BE(6), power * 16);
      for (let i = 0; i < count; i++) {
        const record = 12 + i * 16;
        const tag = font.toString('latin1', record, record + 4);
        const offset = font.readUInt32BE(record + 8);
        const table = font.subarray(offset, offset + font.readUInt32BE(record + 12));
        assert.equal(offset % 4, 0, `${tag} starts on a 4-byte boundary`);
        assert.equal(checksum(table, tag === 'head'), font.readUInt32BE(record + 4), tag);
      }
    });
  }

  it('should read the PostScript name the font carries', () => {
    // source: the font files themselves, Fira Sans as Fontsource packages it (version 5.3.0)
    assert.equal(postscriptName(sfntOfWoff(woff('latin-400'))), 'FiraSans-Regular');
    assert.equal(postscriptName(sfntOfWoff(woff('latin-ext-600'))), 'FiraSans-SemiBold');
  });

  it('should refuse a file that is not WOFF 1.0', () => {
    assert.throws(() => sfntOfWoff(Buffer.from('OTTO and more bytes than a header holds')));
  });
});
