import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { ApiError, request, retryUnlessRefused, setUnauthenticatedHandler, toQuery } from '@/api/client';

function answer(status: number, body: unknown, raw = false): Response {
  return new Response(raw ? String(body) : JSON.stringify(body), {
    status,
    headers: { 'Content-Type': raw ? 'text/html' : 'application/json' },
  });
}

const ThingSchema = z.object({ id: z.string(), count: z.number() });

async function failure(promise: Promise<unknown>): Promise<ApiError> {
  const error = await promise.then(
    () => null,
    (caught: unknown) => caught,
  );
  expect(error).toBeInstanceOf(ApiError);
  return error as ApiError;
}

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('request', () => {
  it('sends JSON with same-origin credentials and returns the parsed answer', async () => {
    const fetchMock = vi.fn().mockResolvedValue(answer(200, { id: 'a1', count: 3, extra: true }));
    vi.stubGlobal('fetch', fetchMock);

    const result = await request('POST', '/api/things', ThingSchema, { name: 'Front counter' });

    // Unknown keys are dropped by zod's default object parsing (zod 4 docs, "Objects").
    expect(result).toEqual({ id: 'a1', count: 3 });
    const [url, init] = fetchMock.mock.calls[0] as [string, RequestInit];
    expect(url).toBe('/api/things');
    expect(init.method).toBe('POST');
    // Cookies ride along only to our own origin (Fetch standard, RequestCredentials "same-origin").
    expect(init.credentials).toBe('same-origin');
    expect(new Headers(init.headers).get('Content-Type')).toBe('application/json');
    expect(init.body).toBe('{"name":"Front counter"}');
  });

  it('turns a 400 with field details into one ApiError carrying those details', async () => {
    // Body shape from shared/schemas/error.schema.ts (ErrorBodySchema).
    const body = {
      error: {
        code: 'VALIDATION_FAILED',
        message: 'Check the highlighted fields.',
        details: { email: ['Enter a valid e-mail address'], password: ['Use at least 12 characters'] },
      },
    };
    vi.stubGlobal('fetch', vi.fn().mockResolvedValue(answer(400, body)));

    const error = await failure(request('POST', '/api/auth/sign-up', ThingSchema, {}));

    expect(error.status).toBe(400);
    expect(error.code).toBe('VALIDATION_FAILED');
    expect(error.message).toBe('Check the highlighted fields.');
    expect(error.fieldMessage('email')).toBe('Enter a valid e-mail address');
    expect(error.fieldMessage('password')).toBe('Use at least 12 characters');
    expect(error.fieldMessage('displayName')).toBeUndefined();
  });

  it('keeps the server code for a 401', async () => {
    const body = { error: { code: 'UNAUTHENTICATED', message: 'Sign in first.' } };
    vi.stubGlobal('fetch', vi.fn().mockResolvedValue(answer(401, body)));

    const error = await failure(request('GET', '/api/plans', ThingSchema));

    // 401 Unauthorized, RFC 9110 section 15.5.2; code name from shared/schemas/error.schema.ts.
    expect(error.status).toBe(401);
    expect(error.code).toBe('UNAUTHENTICATED');
    expect(error.details).toEqual({});
  });

  it('names an error body it cannot read by its status', async () => {
    vi.stubGlobal('fetch', vi.fn().mockResolvedValue(answer(429, '<html>slow down</html>', true)));

    const error = await failure(request('POST', '/api/auth/sign-in', ThingSchema, {}));

    // 429 Too Many Requests, RFC 6585 section 4.
    expect(error.status).toBe(429);
    expect(error.code).toBe('RATE_LIMITED');
  });

  it('reports a network failure as NETWORK with status 0', async () => {
    vi.stubGlobal('fetch', vi.fn().mockRejectedValue(new TypeError('Failed to fetch')));

    const error = await failure(request('GET', '/api/plans', ThingSchema));

    expect(error.code).toBe('NETWORK');
    // Status 0 is our own marker for "no answer at all" (common practice, no published source).
    expect(error.status).toBe(0);
  });

  it('refuses a 200 answer that does not match the schema', async () => {
    vi.stubGlobal('fetch', vi.fn().mockResolvedValue(answer(200, { id: 7 })));

    const error = await failure(request('GET', '/api/things/7', ThingSchema));

    expect(error.code).toBe('BAD_RESPONSE');
    expect(error.status).toBe(200);
  });

  it('accepts an empty answer when no schema is expected', async () => {
    vi.stubGlobal('fetch', vi.fn().mockResolvedValue(new Response(null, { status: 204 })));

    await expect(request('DELETE', '/api/plans/p1', null)).resolves.toBeUndefined();
  });
});

describe('toQuery', () => {
  it('leaves out empty values and encodes the rest', () => {
    expect(toQuery({ search: 'a&b', role: undefined, page: 2, sort: '' })).toBe('?search=a%26b&page=2');
    expect(toQuery({ role: null })).toBe('');
  });
});

describe('setUnauthenticatedHandler', () => {
  afterEach(() => setUnauthenticatedHandler(null));

  it('is told about an ended session, and the request still fails', async () => {
    const handler = vi.fn();
    setUnauthenticatedHandler(handler);
    const body = { error: { code: 'UNAUTHENTICATED', message: 'Sign in first.' } };
    vi.stubGlobal('fetch', vi.fn().mockResolvedValue(answer(401, body)));

    await failure(request('GET', '/api/plans', ThingSchema));

    expect(handler).toHaveBeenCalledTimes(1);
  });

  it('is not told about a wrong password', async () => {
    const handler = vi.fn();
    setUnauthenticatedHandler(handler);
    const body = { error: { code: 'BAD_CREDENTIALS', message: 'Wrong.' } };
    vi.stubGlobal('fetch', vi.fn().mockResolvedValue(answer(401, body)));

    await failure(request('POST', '/api/auth/sign-in', ThingSchema, {}));

    expect(handler).not.toHaveBeenCalled();
  });
});

describe('retryUnlessRefused', () => {
  it('shows a refusal at once and tries a server or network failure twice more', () => {
    // HTTP semantics (RFC 9110 §15.5, §15.6): 4xx says the request itself will not succeed as sent; 5xx may pass.
    const refused = new ApiError(403, 'SECOND_FACTOR_REQUIRED', 'Set up an authenticator app first.');
    expect(retryUnlessRefused(0, refused)).toBe(false);
    expect(retryUnlessRefused(0, new ApiError(404, 'NOT_FOUND', 'No such plan.'))).toBe(false);
    const broken = new ApiError(503, 'INTERNAL', 'Try again later.');
    expect([0, 1, 2].map((n) => retryUnlessRefused(n, broken))).toEqual([true, true, false]);
    expect(retryUnlessRefused(0, new TypeError('Failed to fetch'))).toBe(true);
  });
});
