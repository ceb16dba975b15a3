/**
 * The one error handler: every failure becomes `{ "error": { "code", "message", "details"? } }`.
 *   AppError                  -> its status and code
 *   ZodError                  -> 400 validation_failed, details [{ path, message }] naming each field
 *   AnalysisInputError        -> 400 bad_input
 *   body-parser errors        -> 400 bad_json (413 payload_too_large for an oversized body)
 *   multer errors             -> 413 payload_too_large (file size) or 400 validation_failed
 *   anything else             -> logged with pino, 500 internal (no stack, no message from inside)
 */
import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { Logger } from 'pino';
import { ZodError } from 'zod';
import { isAnalysisInputError } from '../../analysis/errors';
import type { ErrorCode, ErrorDetail, ErrorResponse } from '../contracts/common';
import { AppError, notFound } from '../errors';

interface Problem {
  status: number;
  code: ErrorCode;
  message: string;
  details?: ErrorDetail[];
}

function zodProblem(e: ZodError): Problem {
  const details = e.issues.map((i) => ({ path: i.path.map(String).join('.'), message: i.message }));
  const fields = [...new Set(details.map((d) => d.path || '(body)'))];
  return {
    status: 400,
    code: 'validation_failed',
    message: `check ${fields.length === 1 ? 'this field' : 'these fields'}: ${fields.join(', ')}`,
    details,
  };
}

interface HttpishError {
  type?: unknown;
  status?: unknown;
  statusCode?: unknown;
  name?: unknown;
  code?: unknown;
  field?: unknown;
}

/** Known operational errors → a problem; anything else → null (a programmer error). */
export function toProblem(err: unknown): Problem | null {
  if (err instanceof AppError) return { status: err.status, code: err.code, message: err.message, details: err.details };
  if (err instanceof ZodError) return zodProblem(err);
  if (isAnalysisInputError(err)) return { status: 400, code: 'bad_input', message: err.message };
  if (typeof err !== 'object' || err === null) return null;
  const e = err as HttpishError;
  // body-parser (express.json) marks its errors with `type`
  if (e.type === 'entity.parse.failed') {
    return { status: 400, code: 'bad_json', message: 'the request body is not valid JSON' };
  }
  if (e.type === 'entity.too.large') {
    return { status: 413, code: 'payload_too_large', message: 'the request body is too large' };
  }
  if (typeof e.type === 'string' && (e.type.startsWith('entity.') || e.type.endsWith('.unsupported') || e.type === 'request.aborted')) {
    const status = typeof e.status === 'number' && e.status >= 400 && e.status < 500 ? e.status : 400;
    return { status, code: 'bad_json', message: 'the request body could not be read as JSON' };
  }
  if (e.name === 'MulterError') {
    if (e.code === 'LIMIT_FILE_SIZE') {
      return { status: 413, code: 'payload_too_large', message: 'the file is larger than the upload limit' };
    }
    const field = typeof e.field === 'string' ? e.field : '';
    return {
      status: 400,
      code: 'validation_failed',
      message: `the upload was refused (${String(e.code)})`,
      details: [{ path: field, message: String(e.code) }],
    };
  }
  return null;
}

export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, next) => {
    if (res.headersSent) return next(err);
    let problem = toProblem(err);
    if (!problem) {
      logger.error({ err, method: req.method, url: req.originalUrl }, 'unhandled error');
      problem = { status: 500, code: 'internal', message: 'something went wrong on the server; the error has been logged' };
    }
    const body: ErrorResponse = { error: { code: problem.code, message: problem.message } };
    if (problem.details) body.error.details = problem.details;
    res.status(problem.status).json(body);
  };
}

/** Unknown /api routes: 404 in the JSON error shape. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(notFound(`no API route ${req.method} ${req.originalUrl.split('?')[0]}`));
};
