// Client forms (src/lib/form.ts) validate with the server's own contracts and map the server's
// validation details back onto the same fields.
import { describe, expect, it } from 'vitest';
import { SignUpRequest } from '../../server/contracts/auth';
import { CreateLaserRequest } from '../../server/contracts/lasers';
import { ApiError } from '../../src/lib/api-client';
import { asSentence, errorsFromFailure, formNumber, validateWith } from '../../src/lib/form';

describe('validateWith', () => {
  it('validateWith(SignUpRequest, short password) names the password field with the contract message', () => {
    const r = validateWith(SignUpRequest, { email: 'mira.kestner@example.org', name: 'Mira Kestner', password: 'short' });
    expect(r).toEqual({ ok: false, fieldErrors: { password: 'must be at least 12 characters' } });
  });

  it('validateWith(SignUpRequest, good values) returns the parsed data (e-mail lower-cased)', () => {
    const r = validateWith(SignUpRequest, { email: ' Mira.Kestner@Example.org ', name: 'Mira', password: 'larchmere-demo-2026' });
    expect(r.ok && r.data.email).toBe('mira.kestner@example.org');
  });

  it('validateWith(CreateLaserRequest, both λ and ν) reports the one-unit rule on frequencyThz', () => {
    const r = validateWith(CreateLaserRequest, { name: 'Kestrel ECL-1550', type: 'external-cavity', wavelengthNm: 1550.12, frequencyThz: 193.4 });
    expect(r.ok).toBe(false);
    expect(!r.ok && r.fieldErrors.frequencyThz).toMatch(/not both/);
  });
});

describe('errorsFromFailure', () => {
  const fields = ['name', 'email'] as const;

  it('errorsFromFailure puts details on their fields and leaves no form message', () => {
    const e = new ApiError(400, 'validation_failed', 'Invalid fields', [{ path: 'email', message: 'must be an e-mail address' }]);
    expect(errorsFromFailure(e, fields)).toEqual({ fieldErrors: { email: 'must be an e-mail address' }, formError: null });
  });

  it('errorsFromFailure without details gives the server message for the whole form', () => {
    const e = new ApiError(409, 'conflict', 'A laser with this name is already on the bench.');
    expect(errorsFromFailure(e, fields)).toEqual({ fieldErrors: {}, formError: 'A laser with this name is already on the bench.' });
  });

  it('errorsFromFailure keeps details for fields the form does not have in the form message', () => {
    const e = new ApiError(400, 'validation_failed', 'Invalid fields', [{ path: 'role', message: 'bad role' }]);
    expect(errorsFromFailure(e, fields).formError).toBe('Invalid fields (role: bad role)');
  });

  it('errorsFromFailure maps a nested path to its top-level field', () => {
    const e = new ApiError(400, 'validation_failed', 'Invalid', [{ path: 'name.0', message: 'x' }]);
    expect(errorsFromFailure(e, fields).fieldErrors).toEqual({ name: 'x' });
  });
});

describe('asSentence and formNumber', () => {
  it('asSentence("must not be empty") gives "Must not be empty."', () => {
    expect(asSentence('must not be empty')).toBe('Must not be empty.');
  });

  it('formNumber reads "", "1550,12" and "abc" as undefined, 1550.12 and NaN', () => {
    const data = new FormData();
    data.set('a', '');
    data.set('b', '1550,12');
    data.set('c', 'abc');
    expect(formNumber(data, 'a')).toBeUndefined();
    expect(formNumber(data, 'b')).toBe(1550.12);
    expect(formNumber(data, 'c')).toBeNaN();
  });
});
