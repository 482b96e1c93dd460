import { closeSync, openSync, readSync } from 'node:fs';

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
 * `read` gives the header's bytes as text, or undefined when they cannot be trusted: no -shm
 * file (yet), or the two copies differing while a commit writes them. A caller keeps nothing on
 * undefined. `close` lets go of the file, when the database is closed.
 */
export function sqliteCommitMark(file: string): { read(): string | undefined; close(): void } {
  const header = Buffer.alloc(2 * HEADER_BYTES);
  let fd: number | undefined;
  const close = (): void => {
    if (fd !== undefined) closeSync(fd);
    fd = undefined;
  };
  const read = (): string | undefined => {
    try {
      // Opened on first use, once this process's own connection has the file in WAL. SQLite
      // removes the -shm file only when the last connection closes, and this process keeps its
      // connection open until it stops: the file opened is the one every commit writes to.
      fd ??= openSync(`${file}-shm`, 'r');
      if (readSync(fd, header, 0, header.length, 0) !== header.length) return undefined;
    } catch {
      return undefined;
    }
    const first = header.subarray(0, HEADER_BYTES);
    if (!first.equals(header.subarray(HEADER_BYTES))) return undefined;
    return first.toString('latin1');
  };
  return { read, close };
}
