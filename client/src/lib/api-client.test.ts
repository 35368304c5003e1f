import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse } from '../testing/render';
import { ApiError, apiRequest, setUnauthorizedHandler } from './api-client';

describe('apiRequest', () => {
  const fetchMock = vi.fn<typeof fetch>();
  const onUnauthorized = vi.fn();

  beforeEach(() => {
    fetchMock.mockReset();
    onUnauthorized.mockReset();
    vi.stubGlobal('fetch', fetchMock);
    setUnauthorizedHandler(onUnauthorized);
  });
  afterEach(() => {
    setUnauthorizedHandler(null);
    vi.unstubAllGlobals();
  });

  it('sends JSON with the session cookie and returns the parsed body', async () => {
    fetchMock.mockResolvedValueOnce(jsonResponse([{ id: 'p-1' }]));
    await expect(apiRequest('/api/projects', { method: 'POST', body: { a: 1 } })).resolves.toEqual([{ id: 'p-1' }]);
    const init = fetchMock.mock.calls[0]?.[1];
    expect(init?.credentials).toBe('include');
    expect(init?.body).toBe('{"a":1}');
    expect(init?.headers).toMatchObject({ 'Content-Type': 'application/json' });
  });

  it('returns undefined for 204 No Content', async () => {
    fetchMock.mockResolvedValueOnce(new Response(null, { status: 204 }));
    await expect(apiRequest('/api/auth/sign-out', { method: 'POST' })).resolves.toBeUndefined();
  });

  it('throws an ApiError carrying the server body and Retry-After', async () => {
    fetchMock.mockResolvedValueOnce(
      jsonResponse({ statusCode: 429, code: 'throttled', message: 'Slow down.' }, 429, { 'Retry-After': '12' }),
    );
    const error = await apiRequest('/api/auth/sign-in').catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 429, retryAfterS: 12, body: { code: 'throttled', message: 'Slow down.' } });
  });

  it('falls back to a readable message when the error body is not ours', async () => {
    fetchMock.mockResolvedValueOnce(new Response('<html>bad gateway</html>', { status: 502 }));
    await expect(apiRequest('/api/projects')).rejects.toMatchObject({
      status: 502,
      body: { code: 'http_502', message: 'The server answered 502.' },
    });
  });

  it('calls the unauthorized handler on 401 unless 401 is expected', async () => {
    const body = { statusCode: 401, code: 'unauthorized', message: 'Sign in first.' };
    fetchMock.mockResolvedValueOnce(jsonResponse(body, 401)).mockResolvedValueOnce(jsonResponse(body, 401));

    await expect(apiRequest('/api/projects')).rejects.toBeInstanceOf(ApiError);
    expect(onUnauthorized).toHaveBeenCalledTimes(1);
    await expect(apiRequest('/api/auth/me', { isUnauthorizedExpected: true })).rejects.toBeInstanceOf(ApiError);
    expect(onUnauthorized).toHaveBeenCalledTimes(1);
  });
});
