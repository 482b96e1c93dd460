import { watch, type FSWatcher } from 'node:fs';

/**
 * Whether a folder may have changed since it was last read, from the system's change
 * notifications (inotify on Linux): while nothing has happened in it, what was read before still
 * stands, and a request need not list and stat every file again. Where notifications are not
 * available, or the watch is lost (the folder removed or moved away), every read is a fresh one.
 */
export class FolderWatch {
  private watcher: FSWatcher | undefined;
  private changed = true;

  constructor(private readonly folder: string) {}

  /**
   * Call just before reading the folder: whether it must be read again. From this call on, any
   * change marks it again, so a change made while it is being read is not lost.
   */
  needsRead(): boolean {
    if (!this.watcher) this.start();
    const needed = this.changed || !this.watcher;
    this.changed = false;
    return needed;
  }

  /** Whether nothing has changed since the last needsRead, without asking as needsRead does. */
  unchanged(): boolean {
    return this.watcher !== undefined && !this.changed;
  }

  /** The folder changed in a way no notification may have told yet (a save, a failed read). */
  markChanged(): void {
    this.changed = true;
  }

  close(): void {
    this.watcher?.close();
    this.watcher = undefined;
    this.changed = true;
  }

  private start(): void {
    try {
      // Not persistent: a watch must never keep a process (a CLI run, a test) alive.
      this.watcher = watch(this.folder, { persistent: false }, (event) => {
        this.changed = true;
        // A rename may be the folder itself removed or moved: watch it afresh on the next read.
        if (event === 'rename') this.close();
      });
      this.watcher.on('error', () => this.close());
    } catch {
      this.watcher = undefined; // no folder, or no notifications here: read every time
    }
    this.changed = true;
  }
}
