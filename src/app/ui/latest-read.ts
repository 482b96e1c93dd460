import { effect, signal, untracked } from '@angular/core';
import { messageOf } from '../core/api/message-of';

/**
 * One thing read from the API for the latest key asked: its value, or why the read failed in
 * words, and whether a read is under way. An answer to an earlier ask that arrives after a later
 * one is dropped, so a page never shows one batch's figures under another's lot code.
 */
export class LatestRead<K, T> {
  /** The latest answer; null until it has come, and again while the next key is read. */
  readonly value = signal<T | null>(null);
  readonly error = signal<string | null>(null);
  readonly loading = signal(false);
  private request = 0;
  private key: K | undefined;

  /** @param read asks the API for one key's value */
  constructor(private readonly read: (key: K) => Promise<T>) {}

  /** Reads the value of `key`, forgetting the one shown. */
  async load(key: K): Promise<void> {
    const request = ++this.request;
    this.key = key;
    this.value.set(null);
    this.error.set(null);
    this.loading.set(true);
    try {
      const value = await this.read(key);
      if (request === this.request) this.value.set(value);
    } catch (error) {
      if (request === this.request) this.error.set(messageOf(error));
    } finally {
      if (request === this.request) this.loading.set(false);
    }
  }

  /** Reads the last key asked again (Try again). */
  retry(): void {
    if (this.key !== undefined) void this.load(this.key);
  }
}

/**
 * A {@link LatestRead} that follows a key: read whenever `key` gives a new one, never while it
 * gives null (not shown to this person). Call it where `effect` works (a component's field).
 */
export function latestRead<K, T>(
  key: () => K | null,
  read: (key: K) => Promise<T>,
): LatestRead<K, T> {
  const latest = new LatestRead(read);
  effect(() => {
    const current = key();
    if (current !== null) untracked(() => void latest.load(current));
  });
  return latest;
}
