/**
 * The one typed request function of the client. Every answer is parsed with the shared zod schema;
 * every failure becomes an ApiError so components handle one error shape.
 */
import type { z } from 'zod';
import { ERROR_CODE_BY_STATUS, ErrorBodySchema, type ErrorCode } from '@shared/schemas';

/** Server codes plus the two the client raises itself. */
export type ApiErrorCode = ErrorCode | 'NETWORK' | 'BAD_RESPONSE';

export class ApiError extends Error {
  readonly status: number;
  readonly code: ApiErrorCode;
  readonly details: Record<string, string[]>;

  constructor(status: number, code: ApiErrorCode, message: string, details: Record<string, string[]> = {}) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.details = details;
  }

  /** First message for one field, for NFormItem feedback. */
  fieldMessage(field: string): string | undefined {
    return this.details[field]?.[0];
  }
}

/**
 * The data-loading kit's retry rule for every query: a refusal (4xx: not signed in, no right, not found, bad
 * input) is final and shown at once; a server or network failure is tried twice more.
 */
export function retryUnlessRefused(failures: number, error: unknown): boolean {
  return !(error instanceof ApiError && error.status >= 400 && error.status < 500) && failures < 2;
}

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

type UnauthenticatedHandler = (error: ApiError) => void;
let onUnauthenticated: UnauthenticatedHandler | null = null;

/** The app registers one handler for an expired session (send the user to sign-in); the request still fails. */
export function setUnauthenticatedHandler(handler: UnauthenticatedHandler | null): void {
  onUnauthenticated = handler;
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (!text) return undefined;
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

function errorFromResponse(status: number, body: unknown): ApiError {
  const parsed = ErrorBodySchema.safeParse(body);
  if (parsed.success) {
    const { code, message, details } = parsed.data.error;
    return new ApiError(status, code, message, details);
  }
  const code = ERROR_CODE_BY_STATUS[status] ?? 'INTERNAL';
  return new ApiError(
    status,
    code,
    `The server answered ${status} without an explanation. Try again in a moment.`,
  );
}

/**
 * Send one JSON request to the API and return the answer parsed with `schema`.
 * Pass `null` as the schema for answers without a body (204).
 */
export async function request<S extends z.ZodType>(
  method: HttpMethod,
  path: string,
  schema: S,
  body?: unknown,
): Promise<z.output<S>>;
export async function request(method: HttpMethod, path: string, schema: null, body?: unknown): Promise<void>;
export async function request(
  method: HttpMethod,
  path: string,
  schema: z.ZodType | null,
  body?: unknown,
): Promise<unknown> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  // A FormData body (file uploads) sets its own multipart Content-Type with the boundary.
  const form = body instanceof FormData;
  if (body !== undefined && !form) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      credentials: 'same-origin',
      body: body === undefined ? undefined : form ? body : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(
      0,
      'NETWORK',
      'Leadbench cannot reach its server. Check your connection and try again.',
    );
  }

  const json = await readJson(response);
  if (!response.ok) {
    const error = errorFromResponse(response.status, json);
    if (error.code === 'UNAUTHENTICATED') onUnauthenticated?.(error);
    throw error;
  }
  if (schema === null) return undefined;

  const parsed = schema.safeParse(json);
  if (!parsed.success) {
    throw new ApiError(
      response.status,
      'BAD_RESPONSE',
      'The server sent an answer this page does not understand. Reload the page; if it persists, the app may be updating.',
    );
  }
  return parsed.data;
}

/** Build a query string from defined values only. */
export function toQuery(params: Record<string, string | number | undefined | null>): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value !== undefined && value !== null && value !== '') search.set(key, String(value));
  }
  const text = search.toString();
  return text ? `?${text}` : '';
}
