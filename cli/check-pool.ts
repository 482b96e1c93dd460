// Reads many formula files on several threads. `larder check` of a large folder is bound by YAML
// parsing (about 1 ms a file on its own), which only more CPUs make faster.
import { setImmediate as nextTurn } from 'node:timers/promises';
import { Worker } from 'node:worker_threads';
import type { FormulaReading } from '../shared/index.ts';
import type { CheckBatch, CheckedBatch } from './check-worker.ts';
import { readFormulaFile } from './formula-files.ts';

/**
 * Most files handed out at a time: enough that a message costs little beside the ~50 ms of
 * reading them. Toward the end batches shrink, down to the fewest, so that the threads finish
 * together rather than all waiting on the one with the last big batch.
 */
const MOST_PER_BATCH = 50;
const FEWEST_PER_BATCH = 10;

/**
 * The worker's script. The command runs from its bundle, where this module is part of
 * dist/cli/larder.js and the worker is the entry point dist/cli/check-worker.js beside it.
 */
const WORKER_SCRIPT = new URL('./check-worker.js', import.meta.url);

/** How to read the files. */
export interface PoolOptions {
  /** Threads to read on, the main one included; 1 reads every file on the main thread. */
  readonly threads: number;
  /** Called with the number of files read so far, after each batch. */
  readonly onProgress?: (done: number) => void;
  /** Called when a worker thread fails; the other threads read its files. */
  readonly onWorkerFailure?: (reason: string) => void;
  /** The worker's script: tests run from source give the built one, or one that fails. */
  readonly workerScript?: URL;
}

/**
 * Reads and checks files with readFormulaFile on the main thread and `threads - 1` workers, which
 * take batches from one queue so that a thread slowed by other work holds up no one. The readings
 * come back in the order of `files`. A worker that fails gives its batch back to the queue: every
 * file is read, by the main thread if need be, however many workers fail.
 */
export async function readFormulaFilesOnThreads(
  files: readonly string[],
  options: PoolOptions,
): Promise<FormulaReading[]> {
  const readings = new Array<FormulaReading>(files.length);
  const finished = new Set<number>();
  let done = 0;
  let wake: (() => void) | undefined;
  const pool: Pool = {
    files,
    queue: new BatchQueue(files.length, options.threads),
    finish(start, batch) {
      // A worker may fail after answering, and its batch be given back: count it once.
      if (!finished.has(start)) {
        finished.add(start);
        batch.forEach((reading, i) => (readings[start + i] = reading));
        done += batch.length;
        options.onProgress?.(done);
      }
      wake?.();
    },
    failed(reason) {
      options.onWorkerFailure?.(reason);
      wake?.();
    },
  };
  const workerCount = Math.min(options.threads, Math.ceil(files.length / MOST_PER_BATCH)) - 1;
  const workers = Array.from({ length: Math.max(0, workerCount) }, () =>
    startWorker(options.workerScript ?? WORKER_SCRIPT, pool),
  );
  try {
    while (done < files.length) {
      const batch = pool.queue.take();
      if (!batch) {
        // Every batch left is with a worker: wait for an answer or a failure.
        await new Promise<void>((resolve) => (wake = resolve));
        wake = undefined;
        continue;
      }
      if (finished.has(batch.start)) continue;
      const read: FormulaReading[] = [];
      for (let i = batch.start; i < batch.end; i++) {
        read.push(readFormulaFile(files[i]));
        // Let the workers' answers in between files, so that each gets its next batch at once.
        if (workers.some((worker) => worker.alive())) await nextTurn();
      }
      pool.finish(batch.start, read);
    }
  } finally {
    for (const worker of workers) worker.stop();
  }
  return readings;
}

/** Files `start` up to, not including, `end`. */
interface Batch {
  readonly start: number;
  readonly end: number;
}

/** Hands out the files in batches, those given back by a failed worker first. */
class BatchQueue {
  private next = 0;
  private readonly givenBack: Batch[] = [];

  constructor(
    private readonly count: number,
    private readonly threads: number,
  ) {}

  take(): Batch | undefined {
    const back = this.givenBack.shift();
    if (back || this.next >= this.count) return back;
    // A share of what is left small enough that every thread gets about two more batches.
    const share = Math.ceil((this.count - this.next) / (2 * this.threads));
    const size = Math.min(MOST_PER_BATCH, Math.max(FEWEST_PER_BATCH, share));
    const batch = { start: this.next, end: Math.min(this.count, this.next + size) };
    this.next = batch.end;
    return batch;
  }

  giveBack(batch: Batch): void {
    this.givenBack.push(batch);
  }
}

/** What a worker shares with the others. */
interface Pool {
  readonly files: readonly string[];
  readonly queue: BatchQueue;
  finish(start: number, readings: readonly FormulaReading[]): void;
  failed(reason: string): void;
}

/** Starts one worker thread, which takes a batch from the queue whenever it has none. */
function startWorker(script: URL, pool: Pool): { alive(): boolean; stop(): void } {
  let thread: Worker;
  try {
    thread = new Worker(script);
  } catch (error) {
    pool.failed(error instanceof Error ? error.message : String(error));
    return { alive: () => false, stop: () => undefined };
  }
  let alive = true;
  let outstanding: Batch | undefined;
  const giveBatch = (): void => {
    outstanding = pool.queue.take();
    if (!outstanding) return;
    const batch: CheckBatch = {
      start: outstanding.start,
      files: pool.files.slice(outstanding.start, outstanding.end),
    };
    thread.postMessage(batch);
  };
  const fail = (reason: string): void => {
    if (!alive) return;
    alive = false;
    if (outstanding) pool.queue.giveBack(outstanding);
    outstanding = undefined;
    void thread.terminate();
    pool.failed(reason);
  };
  thread.on('message', ({ start, readings }: CheckedBatch) => {
    // An answer is good even from a worker that failed since: it was read all the same.
    pool.finish(start, readings);
    if (alive) giveBatch();
  });
  thread.on('error', (error) => fail(error.message));
  thread.on('exit', (code) => fail(`it exited with code ${code}`));
  giveBatch();
  return {
    alive: () => alive,
    stop() {
      alive = false;
      void thread.terminate();
    },
  };
}
