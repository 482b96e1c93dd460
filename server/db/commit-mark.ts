import { closeSync, fstatSync, openSync, readSync } from 'node:fs';

/** The WAL-index header: two copies of 48 bytes at the start of the -shm file. */
const HEADER_BYTES = 48;

/**
 * A cheap answer to "has anything been committed to this SQLite file since I last looked?", for
 * every connection of every process: the WAL-index header at the start of the file's `-shm`
 * file, which each commit rewrites (its change counter, frame count and checksums) before the
 * commit returns, and which a read never touches. Source: sqlite.org/walformat.html, "The
 * WAL-Index Format" (the header's iChange, "incremented with each transaction"). Reading it is
 * one pread, where asking SQLite is a trip through the thread pool.
 *
 * The returned function gives the header's bytes as text, or undefined when they cannot be
 * trusted: no -shm file (yet), the file since removed, or the two copies differing while a
 * commit writes them. A caller keeps nothing on undefined.
 */
export function sqliteCommitMark(file: string): () => string | undefined {
  const header = Buffer.alloc(2 * HEADER_BYTES);
  let fd: number | undefined;
  return () => {
    try {
      // Opened on first use: the -shm file appears when the first connection goes into WAL.
      fd ??= openSync(`${file}-shm`, 'r');
      // A file removed (the last connection closed) and made anew is another file: look again.
      if (fstatSync(fd).nlink === 0) {
        closeSync(fd);
        fd = undefined;
        return undefined;
      }
      if (readSync(fd, header, 0, header.length, 0) !== header.length) return undefined;
    } catch {
      return undefined;
    }
    const first = header.subarray(0, HEADER_BYTES);
    if (!first.equals(header.subarray(HEADER_BYTES))) return undefined;
    return first.toString('latin1');
  };
}
