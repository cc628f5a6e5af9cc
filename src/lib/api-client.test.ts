import { afterEach, describe, expect, it, vi } from 'vitest';
import { api, ApiError, parseRetryAfter, setUnauthorizedHandler } from './api-client';

function jsonResponse(status: number, body: unknown, headers: Record<string, string> = {}): Response {
  return new Response(body === undefined ? null : JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json', ...headers },
  });
}

function stubFetch(response: Response | Error) {
  const fetchMock = vi.fn(async () => {
    if (response instanceof Error) throw response;
    return response;
  });
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

afterEach(() => {
  vi.unstubAllGlobals();
  setUnauthorizedHandler(null);
});

describe('api client', () => {
  it('sends JSON with same-origin credentials and returns the parsed body', async () => {
    const fetchMock = stubFetch(jsonResponse(201, { user: { id: 'u1' } }));
    const result = await api.post<{ user: { id: string } }>('/api/auth/signup', { email: 'a@b.test' });
    expect(result.user.id).toBe('u1');
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/auth/signup');
    expect(init.method).toBe('POST');
    expect(init.credentials).toBe('same-origin');
    expect(init.body).toBe('{"email":"a@b.test"}');
    expect((init.headers as Record<string, string>)['Content-Type']).toBe('application/json');
  });

  it('resolves a 204 without a body', async () => {
    stubFetch(new Response(null, { status: 204 }));
    await expect(api.post('/api/auth/logout')).resolves.toBeNull();
  });

  it('throws ApiError with the server code, message and field messages', async () => {
    stubFetch(jsonResponse(409, { error: { code: 'email_taken', message: 'Taken', fields: { email: 'Already used' } } }));
    const error = await api.post('/api/auth/signup', {}).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 409, code: 'email_taken', message: 'Taken', fields: { email: 'Already used' } });
  });

  it('reads Retry-After seconds from a 429', async () => {
    stubFetch(jsonResponse(429, { error: { code: 'rate_limited', message: 'Too many' } }, { 'Retry-After': '42' }));
    const error = (await api.post('/api/auth/login', {}).catch((e: unknown) => e)) as ApiError;
    expect(error.code).toBe('rate_limited');
    expect(error.retryAfterSeconds).toBe(42);
  });

  it('names the status when the error body is not our JSON shape', async () => {
    stubFetch(new Response('<html>bad gateway</html>', { status: 502 }));
    const error = (await api.get('/api/me').catch((e: unknown) => e)) as ApiError;
    expect(error.status).toBe(502);
    expect(error.code).toBe('http_502');
    expect(error.fields).toEqual({});
  });

  it('turns a failed connection into a network ApiError with status 0', async () => {
    stubFetch(new TypeError('fetch failed'));
    const error = (await api.get('/api/me').catch((e: unknown) => e)) as ApiError;
    expect(error).toMatchObject({ status: 0, code: 'network' });
  });

  it('tells the registered handler about a 401, once per response', async () => {
    const onUnauthorized = vi.fn();
    setUnauthorizedHandler(onUnauthorized);
    stubFetch(jsonResponse(401, { error: { code: 'unauthorized', message: 'Sign in to continue' } }));
    await api.patch('/api/account', {}).catch(() => undefined);
    expect(onUnauthorized).toHaveBeenCalledTimes(1);
  });

  it('does not call the 401 handler for other errors', async () => {
    const onUnauthorized = vi.fn();
    setUnauthorizedHandler(onUnauthorized);
    stubFetch(jsonResponse(403, { error: { code: 'forbidden', message: 'No' } }));
    await api.patch('/api/account', {}).catch(() => undefined);
    expect(onUnauthorized).not.toHaveBeenCalled();
  });
});

describe('parseRetryAfter', () => {
  it('reads delay-seconds', () => {
    expect(parseRetryAfter('120')).toBe(120);
  });

  it('reads an HTTP date relative to now, rounding up', () => {
    const now = Date.parse('2025-03-01T10:00:00Z');
    expect(parseRetryAfter('Sat, 01 Mar 2025 10:00:30 GMT', now)).toBe(30);
  });

  it('gives null for a missing or unreadable header', () => {
    expect(parseRetryAfter(null)).toBeNull();
    expect(parseRetryAfter('soon')).toBeNull();
  });
});
