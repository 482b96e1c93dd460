import type { Deviation, ReadingAnswer } from '../../shared/api/process-record.ts';
import type { ControlStatus } from '../../shared/process/control-types.ts';
import { EXIT } from '../cli-error.ts';
import type { Io } from '../io.ts';

const STATUS_WORDS: Readonly<Record<ControlStatus, string>> = {
  waiting: 'waiting for a first reading',
  'in-progress': 'in progress, within its limit so far',
  met: 'met',
  missed: 'MISSED',
};

/** A reading's answer in words: what was recorded as typed, and where the control stands now. */
export function readingWords(lot: string, typed: string, answer: ReadingAnswer): string {
  const { reading, state } = answer;
  return (
    `Recorded ${typed} at ${reading.control} of lot ${lot}, taken ${reading.at}.\n` +
    `${reading.control}: ${STATUS_WORDS[state.status]}${state.summary ? `: ${state.summary}` : ''}\n`
  );
}

/**
 * Prints the deviations a reading or a logger file opened and sets the exit code that says so
 * (5): the reading is recorded, the batch is on hold.
 */
export function reportDeviations(io: Io, deviations: readonly Deviation[], json: boolean): void {
  if (!deviations.length) return;
  if (!json) {
    for (const deviation of deviations) io.out(`DEVIATION: ${deviation.what}\n`);
    io.out(
      'The critical limit was missed: the batch is on hold until a corrective action closes each deviation.\n',
    );
  }
  process.exitCode = EXIT.deviation;
}
