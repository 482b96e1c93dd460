import { HttpErrorResponse } from '@angular/common/http';
import { ApiErrorBody } from './api-types';

/** An API failure in words people can read, with the API's stable code and details. */
export class ApiError extends Error {
  override readonly name = 'ApiError';

  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details: readonly unknown[] = [],
  ) {
    super(message);
  }

  /** Reads the API's error envelope, or describes a network failure plainly. */
  static from(response: HttpErrorResponse): ApiError {
    const body = response.error as Partial<ApiErrorBody> | null;
    if (body && typeof body === 'object' && body.error?.message) {
      return new ApiError(
        response.status,
        body.error.code,
        body.error.message,
        body.error.details ?? [],
      );
    }
    if (response.status === 0) {
      return new ApiError(
        0,
        'offline',
        'The server cannot be reached. Check the connection and try again.',
      );
    }
    return new ApiError(
      response.status,
      'http',
      `The server answered ${response.status} ${response.statusText}.`,
    );
  }
}
