// A worker thread of `larder check` (see check-pool.ts): reads and checks each batch of formula
// files it is sent, exactly as the main thread would, and sends the readings back.
import { parentPort } from 'node:worker_threads';
import type { FormulaReading } from '../shared/index.ts';
import { readFormulaFile } from './formula-files.ts';

/** A batch for a worker: files to read, `start` being the index of the first among all files. */
export interface CheckBatch {
  readonly start: number;
  readonly files: readonly string[];
}

/** A worker's answer: the readings of a batch, in the batch's order. */
export interface CheckedBatch {
  readonly start: number;
  readonly readings: readonly FormulaReading[];
}

parentPort?.on('message', ({ start, files }: CheckBatch) => {
  const reply: CheckedBatch = { start, readings: files.map((file) => readFormulaFile(file)) };
  parentPort?.postMessage(reply);
});
