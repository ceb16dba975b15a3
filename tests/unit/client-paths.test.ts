// Client URLs (src/config/paths.ts): every page and API address, and sign-in redirects that never
// leave the site.
import { describe, expect, it } from 'vitest';
import { apiPaths, paths, safeRedirectTarget } from '../../src/config/paths';

describe('paths', () => {
  it('paths.benches.home.getHref(id) fills the router pattern', () => {
    expect(paths.benches.home.path).toBe('/benches/:benchId');
    expect(paths.benches.home.getHref('abc')).toBe('/benches/abc');
    expect(paths.benches.members.getHref('abc')).toBe('/benches/abc/members');
  });

  it('paths.auth.signIn.getHref(target) keeps the intended address, encoded', () => {
    expect(paths.auth.signIn.getHref('/benches/abc?tab=1')).toBe('/sign-in?redirectTo=%2Fbenches%2Fabc%3Ftab%3D1');
    expect(paths.auth.signIn.getHref()).toBe('/sign-in');
  });

  it('apiPaths.benches.captures(id, filters) leaves out empty filters', () => {
    expect(apiPaths.benches.captures('b', { laserId: 'l', kind: undefined, tag: '', page: 2, pageSize: 25 })).toBe(
      '/api/benches/b/captures?laserId=l&page=2&pageSize=25',
    );
    expect(apiPaths.analyses.spectrum('a')).toBe('/api/analyses/a/spectrum');
  });

  it('apiPaths encode ids into one path segment', () => {
    expect(apiPaths.benches.laser('a/b', 'c')).toBe('/api/benches/a%2Fb/lasers/c');
    expect(apiPaths.me()).toBe('/api/me');
  });
});

describe('safeRedirectTarget', () => {
  it.each([
    ['/benches/abc', '/benches/abc'],
    [null, '/benches'],
    ['https://elsewhere.invalid/', '/benches'],
    ['//elsewhere.invalid/x', '/benches'],
    ['/\\elsewhere.invalid', '/benches'],
    ['/sign-in?redirectTo=/x', '/benches'],
  ])('safeRedirectTarget(%j) is %j', (input, expected) => {
    expect(safeRedirectTarget(input)).toBe(expected);
  });
});
