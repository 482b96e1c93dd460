import { createHash } from 'node:crypto';

/**
 * The revision of a text: its sha-256 in hex. A formula's revision, the ETag clients send back in
 * If-Match, and the revision a sheet printed from a file names.
 */
export function revisionOf(text: string): string {
  return createHash('sha256').update(text, 'utf8').digest('hex');
}
