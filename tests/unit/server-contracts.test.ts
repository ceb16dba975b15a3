import { describe, expect, it } from 'vitest';
import { SignInRequest, SignUpRequest } from '../../server/contracts/auth';
import { CreateBenchRequest, UpdateBenchRequest } from '../../server/contracts/benches';
import { CreateLaserRequest, UpdateLaserRequest } from '../../server/contracts/lasers';

const paths = (r: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) =>
  r.error!.issues.map((i) => i.path.join('.')).sort();

describe('contracts', () => {
  it('SignUpRequest trims and lower-cases the e-mail and trims the name', () => {
    expect(SignUpRequest.parse({ email: '  Mira@Example.ORG ', name: ' Mira ', password: 'twelve chars' })).toEqual({
      email: 'mira@example.org',
      name: 'Mira',
      password: 'twelve chars',
    });
  });

  it('SignUpRequest refuses an 11-character password, naming password', () => {
    const r = SignUpRequest.safeParse({ email: 'a@b.org', name: 'A', password: '11 chars!!!' });
    expect(paths(r)).toEqual(['password']);
    expect(r.error!.issues[0].message).toBe('must be at least 12 characters');
  });

  it('SignInRequest accepts any non-empty password (the rule is checked at sign-up)', () => {
    expect(SignInRequest.safeParse({ email: 'a@b.org', password: 'x' }).success).toBe(true);
    expect(paths(SignInRequest.safeParse({ email: 'a@b.org', password: '' }))).toEqual(['password']);
  });

  it('CreateBenchRequest stores an empty description as null', () => {
    expect(CreateBenchRequest.parse({ name: 'B', description: '   ' })).toEqual({ name: 'B', description: null });
  });

  it('UpdateBenchRequest accepts an empty patch and a null description', () => {
    expect(UpdateBenchRequest.parse({})).toEqual({});
    expect(UpdateBenchRequest.parse({ description: null })).toEqual({ description: null });
  });

  it('CreateLaserRequest takes one unit or neither, never both', () => {
    expect(CreateLaserRequest.safeParse({ name: 'L', type: 'dfb', wavelengthNm: 1550 }).success).toBe(true);
    expect(CreateLaserRequest.safeParse({ name: 'L', type: 'dfb', frequencyThz: 193.1 }).success).toBe(true);
    expect(CreateLaserRequest.safeParse({ name: 'L', type: 'dfb' }).success).toBe(true);
    expect(paths(CreateLaserRequest.safeParse({ name: 'L', type: 'dfb', wavelengthNm: 1550, frequencyThz: 193.1 }))).toEqual(['frequencyThz']);
  });

  it('CreateLaserRequest refuses an unknown type and a non-positive wavelength', () => {
    expect(paths(CreateLaserRequest.safeParse({ name: 'L', type: 'gas', wavelengthNm: 0 }))).toEqual(['type', 'wavelengthNm']);
  });

  it('UpdateLaserRequest allows null beside a number (clear one, set the other) but not two numbers', () => {
    expect(UpdateLaserRequest.safeParse({ wavelengthNm: null, frequencyThz: 193.1 }).success).toBe(true);
    expect(UpdateLaserRequest.safeParse({ wavelengthNm: 1550, frequencyThz: 193.1 }).success).toBe(false);
  });
});
