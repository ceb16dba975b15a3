// The client's API layer (src/lib/api-client.ts): requests carry the session cookie, and every
// failure arrives as an ApiError with the server's { error: { code, message, details } } shape.
import { describe, expect, it, vi } from 'vitest';
import { ApiError, apiRequest, toApiError } from '../../src/lib/api-client';

function reply(status: number, body?: unknown): typeof fetch {
  return vi.fn(async () => new Response(body === undefined ? null : JSON.stringify(body), { status })) as unknown as typeof fetch;
}

describe('apiRequest', () => {
  it('apiRequest("POST", url, body) sends JSON with credentials "same-origin"', async () => {
    const fetchImpl = reply(201, { bench: { id: 'x' } });
    const result = await apiRequest('POST', '/api/benches', { name: 'Bench' }, { fetchImpl });
    expect(result).toEqual({ bench: { id: 'x' } });
    const [url, init] = (fetchImpl as unknown as ReturnType<typeof vi.fn>).mock.calls[0];
    expect(url).toBe('/api/benches');
    expect(init.method).toBe('POST');
    expect(init.credentials).toBe('same-origin');
    expect(init.headers['Content-Type']).toBe('application/json');
    expect(JSON.parse(init.body)).toEqual({ name: 'Bench' });
  });

  it('apiRequest("GET", …) sends no body and no Content-Type', async () => {
    const fetchImpl = reply(200, { ok: true });
    await apiRequest('GET', '/api/me', undefined, { fetchImpl });
    const [, init] = (fetchImpl as unknown as ReturnType<typeof vi.fn>).mock.calls[0];
    expect(init.body).toBeUndefined();
    expect(init.headers['Content-Type']).toBeUndefined();
  });

  it('apiRequest resolves undefined for 204 No Content', async () => {
    await expect(apiRequest('DELETE', '/api/benches/a', undefined, { fetchImpl: reply(204) })).resolves.toBeUndefined();
  });

  it('apiRequest rejects with ApiError(code, message, details) from the problem shape', async () => {
    const body = {
      error: {
        code: 'validation_failed',
        message: 'The request has invalid fields.',
        details: [{ path: 'password', message: 'must be at least 12 characters' }],
      },
    };
    const error = await apiRequest('POST', '/api/auth/sign-up', {}, { fetchImpl: reply(400, body) }).catch((e) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      status: 400,
      code: 'validation_failed',
      message: 'The request has invalid fields.',
      details: [{ path: 'password', message: 'must be at least 12 characters' }],
    });
  });

  it('apiRequest turns a failed connection into ApiError status 0 "network_error"', async () => {
    const fetchImpl = vi.fn(async () => {
      throw new TypeError('Failed to fetch');
    }) as unknown as typeof fetch;
    const error = await apiRequest('GET', '/api/me', undefined, { fetchImpl }).catch((e) => e);
    expect(error).toMatchObject({ status: 0, code: 'network_error' });
  });

  it('apiRequest reports an unreadable success body instead of returning garbage', async () => {
    const fetchImpl = vi.fn(async () => new Response('<html>', { status: 200 })) as unknown as typeof fetch;
    await expect(apiRequest('GET', '/api/me', undefined, { fetchImpl })).rejects.toMatchObject({ code: 'bad_response' });
  });
});

describe('toApiError', () => {
  it('toApiError(502, non-JSON) gives a message that says what to do', () => {
    const e = toApiError(502, undefined);
    expect(e.code).toBe('http_502');
    expect(e.message).toMatch(/Try again/);
  });
  it('toApiError joins array paths with dots and drops details without a message', () => {
    const e = toApiError(400, { error: { code: 'validation_failed', message: 'm', details: [{ path: ['lasers', 0, 'name'], message: 'x' }, { path: 'y' }] } });
    expect(e.details).toEqual([{ path: 'lasers.0.name', message: 'x' }]);
  });
});
