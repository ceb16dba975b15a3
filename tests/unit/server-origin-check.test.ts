import type { Request, Response } from 'express';
import { describe, expect, it } from 'vitest';
import { AppError } from '../../server/errors';
import { originCheck } from '../../server/middleware/origin-check';

function run(method: string, headers: Record<string, string>, publicUrl?: string): unknown {
  const lower = Object.fromEntries(Object.entries(headers).map(([k, v]) => [k.toLowerCase(), v]));
  const req = { method, headers: lower, get: (name: string) => lower[name.toLowerCase()] } as unknown as Request;
  let result: unknown = 'not called';
  originCheck({ publicUrl })(req, {} as Response, (err?: unknown) => {
    result = err ?? null;
  });
  return result;
}

const isBadOrigin = (r: unknown) => r instanceof AppError && r.status === 403 && r.code === 'bad_origin';

describe('originCheck', () => {
  it('passes GET and HEAD whatever the headers', () => {
    expect(run('GET', { cookie: 'a=b', origin: 'https://evil.example', host: 'lab:8080' })).toBeNull();
    expect(run('HEAD', { cookie: 'a=b' })).toBeNull();
  });

  it('passes a POST whose Origin names the Host', () => {
    expect(run('POST', { cookie: 'a=b', origin: 'http://lab:8080', host: 'lab:8080' })).toBeNull();
  });

  it('passes a POST whose Origin names PHASELOOM_PUBLIC_URL (behind a proxy)', () => {
    expect(run('PATCH', { cookie: 'a=b', origin: 'https://phaseloom.example.org', host: '127.0.0.1:8080' }, 'https://phaseloom.example.org/')).toBeNull();
  });

  it('refuses an Origin on another host, another port, or "null"', () => {
    expect(isBadOrigin(run('POST', { origin: 'https://evil.example', host: 'lab:8080' }))).toBe(true);
    expect(isBadOrigin(run('DELETE', { origin: 'http://lab:9999', host: 'lab:8080' }))).toBe(true);
    expect(isBadOrigin(run('PUT', { origin: 'null', host: 'lab:8080' }))).toBe(true);
  });

  it('falls back to the Referer when there is no Origin', () => {
    expect(run('POST', { cookie: 'a=b', referer: 'http://lab:8080/benches/x', host: 'lab:8080' })).toBeNull();
    expect(isBadOrigin(run('POST', { cookie: 'a=b', referer: 'http://evil.example/', host: 'lab:8080' }))).toBe(true);
  });

  it('refuses a cookie-carrying POST with neither Origin nor Referer, and passes one without cookie', () => {
    expect(isBadOrigin(run('POST', { cookie: 'phaseloom_session=x', host: 'lab:8080' }))).toBe(true);
    expect(run('POST', { host: 'lab:8080' })).toBeNull();
  });
});
