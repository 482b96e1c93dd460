// A WOFF 1.0 font file as the plain OpenType (SFNT) font it wraps, and the PostScript name in it.
// source of the formats: W3C, WOFF File Format 1.0 (Recommendation, 13 December 2012), §3–5;
// Microsoft, OpenType specification 1.9, "Font file" (table directory) and "name" table
import { inflateSync } from 'node:zlib';

/** The WOFF header's size and a table directory entry's, bytes. */
const WOFF_HEADER = 44;
const WOFF_ENTRY = 20;
/** The SFNT header's size and a table record's, bytes. */
const SFNT_HEADER = 12;
const SFNT_RECORD = 16;

/**
 * The OpenType font inside a WOFF file: each table inflated (WOFF keeps them zlib-compressed),
 * laid out with the table directory an OpenType reader expects. pdfkit's font reader inflates a
 * WOFF table again on every glyph it reads from it (hundreds of milliseconds for a document's
 * fonts); from the plain font it reads them in place.
 */
export function sfntOfWoff(woff: Buffer): Buffer {
  if (woff.toString('latin1', 0, 4) !== 'wOFF') throw new Error('not a WOFF 1.0 font');
  const count = woff.readUInt16BE(12);
  let power = 1;
  let log = 0;
  while (power * 2 <= count) [power, log] = [power * 2, log + 1];
  const head = Buffer.alloc(SFNT_HEADER + SFNT_RECORD * count);
  head.writeUInt32BE(woff.readUInt32BE(4), 0);
  head.writeUInt16BE(count, 4);
  head.writeUInt16BE(power * 16, 6);
  head.writeUInt16BE(log, 8);
  head.writeUInt16BE(count * 16 - power * 16, 10);
  const tables: Buffer[] = [head];
  let offset = head.length;
  for (let i = 0; i < count; i++) {
    const entry = WOFF_HEADER + i * WOFF_ENTRY;
    const [at, packed, length] = [4, 8, 12].map((k) => woff.readUInt32BE(entry + k));
    const stored = woff.subarray(at, at + packed);
    const data = packed < length ? inflateSync(stored) : stored;
    if (data.length !== length) throw new Error('a WOFF table is not the length it says');
    const record = SFNT_HEADER + i * SFNT_RECORD;
    head.writeUInt32BE(woff.readUInt32BE(entry), record);
    head.writeUInt32BE(woff.readUInt32BE(entry + 16), record + 4);
    head.writeUInt32BE(offset, record + 8);
    head.writeUInt32BE(length, record + 12);
    // Each table starts on a 4-byte boundary.
    const padded = Buffer.alloc((length + 3) & ~3);
    data.copy(padded);
    tables.push(padded);
    offset += padded.length;
  }
  return Buffer.concat(tables);
}

/** The PostScript name (name id 6) of an OpenType font, or undefined when it has none. */
export function postscriptName(sfnt: Buffer): string | undefined {
  const count = sfnt.readUInt16BE(4);
  for (let i = 0; i < count; i++) {
    const record = SFNT_HEADER + i * SFNT_RECORD;
    if (sfnt.toString('latin1', record, record + 4) !== 'name') continue;
    const table = sfnt.readUInt32BE(record + 8);
    const names = sfnt.readUInt16BE(table + 2);
    const strings = table + sfnt.readUInt16BE(table + 4);
    for (let n = 0; n < names; n++) {
      const entry = table + 6 + n * 12;
      if (sfnt.readUInt16BE(entry + 6) !== 6) continue;
      const platform = sfnt.readUInt16BE(entry);
      const start = strings + sfnt.readUInt16BE(entry + 10);
      const bytes = sfnt.subarray(start, start + sfnt.readUInt16BE(entry + 8));
      // Windows and Unicode names are UTF-16 big-endian; Macintosh ones are single bytes.
      return platform === 1
        ? bytes.toString('latin1')
        : Buffer.from(bytes).swap16().toString('utf16le');
    }
  }
  return undefined;
}
