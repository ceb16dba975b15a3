/**
 * Form validation with the server's own zod contracts, and the way back: the server's
 * `details: [{ path, message }]` mapped onto the same fields. Messages come from the schemas
 * ("must be at least 12 characters"); the field shows them beside its label.
 */
import type { z } from 'zod';
import { isApiError } from './api-client';

/** field path ("email", "wavelengthNm") → first message for it */
export type FieldErrors = Partial<Record<string, string>>;

export type Validated<T> = { ok: true; data: T } | { ok: false; fieldErrors: FieldErrors };

function pathKey(path: readonly PropertyKey[]): string {
  return path.map((p) => String(p)).join('.');
}

/** Runs a contract schema over the form's values; on failure, the first message per field. */
export function validateWith<S extends z.ZodType>(schema: S, values: unknown): Validated<z.output<S>> {
  const parsed = schema.safeParse(values);
  if (parsed.success) return { ok: true, data: parsed.data };
  const fieldErrors: FieldErrors = {};
  for (const issue of parsed.error.issues) {
    const key = pathKey(issue.path);
    if (fieldErrors[key] === undefined) fieldErrors[key] = issue.message;
  }
  return { ok: false, fieldErrors };
}

export interface SubmitErrors {
  fieldErrors: FieldErrors;
  /** a message for the whole form (errors that belong to no field on it) */
  formError: string | null;
}

/**
 * Splits a failed request into messages for the form's fields (server validation details whose
 * path is one of `fields`) and one message for the form (everything else).
 */
export function errorsFromFailure(error: unknown, fields: readonly string[]): SubmitErrors {
  if (!isApiError(error)) {
    return { fieldErrors: {}, formError: 'Something went wrong in the page itself. Reload and try again.' };
  }
  const fieldErrors: FieldErrors = {};
  const leftover: string[] = [];
  for (const detail of error.details) {
    const top = detail.path.split('.')[0];
    if (fields.includes(detail.path) || fields.includes(top)) {
      const key = fields.includes(detail.path) ? detail.path : top;
      if (fieldErrors[key] === undefined) fieldErrors[key] = detail.message;
    } else {
      leftover.push(detail.path ? `${detail.path}: ${detail.message}` : detail.message);
    }
  }
  const mapped = Object.keys(fieldErrors).length > 0;
  let formError: string | null = null;
  if (!mapped || leftover.length > 0) {
    formError = leftover.length > 0 ? `${error.message} (${leftover.join('; ')})` : error.message;
  }
  return { fieldErrors, formError };
}

/** "must not be empty" → "Must not be empty." — for showing a schema message on its own line. */
export function asSentence(message: string): string {
  const m = message.trim();
  if (!m) return m;
  const first = m.charAt(0).toUpperCase() + m.slice(1);
  return /[.!?)]$/.test(first) ? first : `${first}.`;
}

/** The text of a form field, or '' when missing (FormData gives File for file inputs; not used here). */
export function formText(data: FormData, name: string): string {
  const v = data.get(name);
  return typeof v === 'string' ? v : '';
}

/**
 * A number field: '' → undefined (not given), otherwise Number(text) with a decimal comma accepted
 * ("1550,12"). A text that is not a number becomes NaN, which the schema rejects.
 */
export function formNumber(data: FormData, name: string): number | undefined {
  const text = formText(data, name).trim().replace(',', '.');
  if (text === '') return undefined;
  const n = Number(text);
  return Number.isNaN(n) ? Number.NaN : n;
}
