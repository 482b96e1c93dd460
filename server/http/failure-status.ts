import type { RecordsError, RecordsFailure } from '../records/records-error.ts';
import { AppError } from './app-error.ts';

/** The HTTP status of each kind of record-keeping failure: the API's one reading of them. */
export const FAILURE_STATUS: Readonly<Record<RecordsFailure, number>> = {
  'bad-input': 400,
  forbidden: 403,
  'not-found': 404,
  conflict: 409,
  refused: 422,
};

/** The kind of record-keeping failure an HTTP status says, if it says one. */
export function failureOfStatus(status: number): RecordsFailure | undefined {
  return (Object.keys(FAILURE_STATUS) as RecordsFailure[]).find(
    (kind) => FAILURE_STATUS[kind] === status,
  );
}

/** A record-keeping failure as the API answers it: its status, with its own code and words. */
export function appErrorOf(error: RecordsError): AppError {
  return new AppError(FAILURE_STATUS[error.kind], error.code, error.message, error.details);
}
