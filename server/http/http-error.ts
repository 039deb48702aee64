/** An expected failure with a status and a code from the shared list; the error handler renders it. */
import type { ErrorCode } from '../../shared/schemas/error.schema';

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly details?: Record<string, string[]>,
    readonly problemCount?: number,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const notFound = (what = 'That item'): HttpError =>
  new HttpError(404, 'NOT_FOUND', `${what} was not found.`);
