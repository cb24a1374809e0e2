// The one error type of the calculation core. Callers map `code` to their own error shapes
// (the server answers 'invalid_input' / 'unknown_section' / 'unsupported' with 422).
export type EngineErrorCode = 'unknown_section' | 'invalid_input' | 'unsupported';

export class EngineError extends Error {
  readonly code: EngineErrorCode;

  constructor(code: EngineErrorCode, message: string) {
    super(message);
    this.name = 'EngineError';
    this.code = code;
  }
}

export function isEngineError(error: unknown): error is EngineError {
  return error instanceof EngineError;
}
