import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { AnalysisInputError } from '../../analysis/errors';
import { AppError } from '../../server/errors';
import { toProblem } from '../../server/middleware/error-handler';

describe('toProblem', () => {
  it('maps a ZodError to 400 validation_failed with one detail per issue and dotted paths', () => {
    const schema = z.object({ name: z.string().min(1, 'must not be empty'), lasers: z.array(z.object({ nm: z.number() })) });
    const result = schema.safeParse({ name: '', lasers: [{ nm: 1 }, { nm: 'x' }] });
    const problem = toProblem(result.error);
    expect(problem).toMatchObject({ status: 400, code: 'validation_failed', message: 'check these fields: name, lasers.1.nm' });
    expect(problem!.details).toEqual([
      { path: 'name', message: 'must not be empty' },
      { path: 'lasers.1.nm', message: expect.any(String) },
    ]);
  });

  it('names the whole body as "(body)" in the message when the body itself is wrong', () => {
    const result = z.object({ a: z.string() }).safeParse(undefined);
    expect(toProblem(result.error)).toMatchObject({ message: 'check this field: (body)', details: [{ path: '' }] });
  });

  it('maps AppError to its own status, code and message', () => {
    expect(toProblem(new AppError(409, 'conflict', 'taken'))).toEqual({ status: 409, code: 'conflict', message: 'taken', details: undefined });
  });

  it('maps AnalysisInputError to 400 bad_input', () => {
    expect(toProblem(new AnalysisInputError('segment must be a power of two', 'segment'))).toEqual({
      status: 400,
      code: 'bad_input',
      message: 'segment must be a power of two (segment)',
    });
  });

  it('maps body-parser errors: bad JSON → 400 bad_json, too large → 413', () => {
    expect(toProblem(Object.assign(new SyntaxError('Unexpected end'), { type: 'entity.parse.failed', status: 400 }))).toMatchObject({
      status: 400,
      code: 'bad_json',
    });
    expect(toProblem(Object.assign(new Error('too big'), { type: 'entity.too.large', status: 413 }))).toMatchObject({
      status: 413,
      code: 'payload_too_large',
    });
  });

  it('maps a multer file-size error to 413', () => {
    expect(toProblem(Object.assign(new Error('File too large'), { name: 'MulterError', code: 'LIMIT_FILE_SIZE' }))).toMatchObject({
      status: 413,
      code: 'payload_too_large',
    });
  });

  it('leaves anything else to the 500 path (null)', () => {
    expect(toProblem(new TypeError('x is undefined'))).toBeNull();
    expect(toProblem('a string')).toBeNull();
  });
});
