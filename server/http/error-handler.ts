/**
 * The one place errors become responses. Every failure leaves as
 * `{ error: { code, message, details? } }` (ErrorBodySchema); unexpected ones are logged and answered
 * with a generic 500 so no internals reach the client.
 */
import type { ErrorRequestHandler, RequestHandler, Response } from 'express';
import { ZodError } from 'zod';
import { ERROR_CODE_BY_STATUS, type ErrorBody, type ErrorCode } from '../../shared/schemas/error.schema';
import { HttpError } from './http-error';
import { issuesByPath, problemsMessage } from './validate';

export function sendError(
  res: Response,
  status: number,
  code: ErrorCode,
  message: string,
  details?: Record<string, string[]>,
  problemCount?: number,
): void {
  const body: ErrorBody = {
    error: {
      code,
      message,
      ...(details ? { details } : {}),
      ...(problemCount === undefined ? {} : { problemCount }),
    },
  };
  res.status(status).json(body);
}

/** body-parser marks its errors with a `type`; map the ones a client can cause. */
interface BodyParserError {
  type: string;
  status?: number;
}
const isBodyParserError = (err: unknown): err is BodyParserError =>
  typeof err === 'object' && err !== null && typeof (err as { type?: unknown }).type === 'string';

/** The 4xx status an error carries (http-errors style `status`/`statusCode`), or null. */
function clientErrorStatus(err: unknown): number | null {
  if (typeof err !== 'object' || err === null) return null;
  const { status, statusCode } = err as { status?: unknown; statusCode?: unknown };
  const value = typeof status === 'number' ? status : statusCode;
  return typeof value === 'number' && value >= 400 && value < 500 ? value : null;
}

/** node:zlib errors carry codes like Z_DATA_ERROR (gzip, deflate) or ERR__ERROR_FORMAT_… (br). */
const isZlibError = (err: unknown): boolean =>
  typeof err === 'object' &&
  err !== null &&
  typeof (err as { errno?: unknown }).errno === 'number' &&
  /^(Z_|ERR__)/.test(String((err as { code?: unknown }).code ?? ''));

export const apiNotFound: RequestHandler = (req, res) => {
  sendError(res, 404, 'NOT_FOUND', `There is no API route ${req.method} ${req.path}.`);
};

export const errorHandler: ErrorRequestHandler = (err, req, res, next) => {
  if (res.headersSent) return next(err);
  if (err instanceof HttpError && 'retryAfterMs' in err && typeof err.retryAfterMs === 'number') {
    res.setHeader('Retry-After', String(Math.ceil(err.retryAfterMs / 1000)));
  }
  if (err instanceof HttpError)
    return sendError(res, err.status, err.code, err.message, err.details, err.problemCount);
  if (err instanceof ZodError) {
    const problems = issuesByPath(err.issues);
    const message = problemsMessage('Some fields need attention.', problems);
    return sendError(res, 400, 'VALIDATION_FAILED', message, problems.details, problems.problemCount);
  }
  if (isBodyParserError(err)) {
    switch (err.type) {
      case 'entity.parse.failed':
        return sendError(res, 400, 'BAD_JSON', 'The request body is not valid JSON.');
      case 'entity.too.large':
        return sendError(res, 413, 'PAYLOAD_TOO_LARGE', 'The request body is too large.');
      case 'encoding.unsupported':
      case 'charset.unsupported':
        return sendError(res, 400, 'BAD_JSON', 'Send the body as UTF-8 JSON.');
      case 'request.aborted':
      case 'request.size.invalid':
        return sendError(res, 400, 'BAD_JSON', 'The request body arrived incomplete.');
    }
  }
  if (isZlibError(err)) {
    // body-parser hands on the decompressor's error for a damaged gzip, deflate or br body.
    return sendError(res, 400, 'BAD_BODY', 'The compressed request body is damaged.');
  }
  const status = clientErrorStatus(err);
  if (status !== null) {
    // Other client errors raised inside Express or its middleware, e.g. a malformed %-escape in the path.
    return sendError(
      res,
      status,
      ERROR_CODE_BY_STATUS[status] ?? 'VALIDATION_FAILED',
      'The request could not be understood.',
    );
  }
  req.log?.error({ err }, 'unhandled error');
  sendError(res, 500, 'INTERNAL', 'Something went wrong on the server. Please try again.');
};
