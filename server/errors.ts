/**
 * AppError: an operational error with an HTTP status and a machine-readable code. Services throw
 * these; the one error handler (middleware/error-handler.ts) turns them into the JSON error shape.
 * Anything that is not an AppError, a ZodError or an AnalysisInputError is a programmer error: 500.
 */
import type { ErrorCode, ErrorDetail } from './contracts/common';

export class AppError extends Error {
  readonly status: number;
  readonly code: ErrorCode;
  readonly details?: ErrorDetail[];

  constructor(status: number, code: ErrorCode, message: string, details?: ErrorDetail[]) {
    super(message);
    this.name = 'AppError';
    this.status = status;
    this.code = code;
    this.details = details;
  }
}

export const notFound = (message = 'not found') => new AppError(404, 'not_found', message);
export const forbidden = (message = 'your role on this bench does not allow this') =>
  new AppError(403, 'forbidden', message);
export const conflict = (message: string) => new AppError(409, 'conflict', message);
export const unauthenticated = (message = 'sign in first') => new AppError(401, 'unauthenticated', message);
