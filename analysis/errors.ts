/**
 * AnalysisInputError — the one error type analysis/ throws for bad input or bad options.
 * A RangeError: no logging, no HTTP codes. The server maps it to 400, the CLI to exit status 2.
 * `where` names the place in the input (row, byte offset, header field) when there is one.
 */
export class AnalysisInputError extends RangeError {
  readonly where?: string;
  constructor(message: string, where?: string) {
    super(where ? `${message} (${where})` : message);
    this.name = 'AnalysisInputError';
    this.where = where;
  }
}

export function isAnalysisInputError(e: unknown): e is AnalysisInputError {
  return e instanceof AnalysisInputError;
}
