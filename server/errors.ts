// Known errors of the API: each carries its HTTP status and the code of docs/contracts.md §Errors.
import type { ErrorCode } from '../shared/schema/errors.ts';

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly details?: unknown,
    /** Sent as Retry-After with a 503: when trying again makes sense. */
    readonly retryAfterSeconds?: number,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const badRequest = (message: string, details?: unknown) => new HttpError(400, 'bad_request', message, details);
export const unauthenticated = (message = 'Sign in to continue') => new HttpError(401, 'unauthenticated', message);
export const forbidden = (message = 'Your role does not allow this') => new HttpError(403, 'forbidden', message);
export const notFound = (what = 'Resource') => new HttpError(404, 'not_found', `${what} not found`);
export const conflict = (message: string, details?: unknown) => new HttpError(409, 'conflict', message, details);
export const unprocessable = (message: string, details?: unknown) =>
  new HttpError(422, 'unprocessable', message, details);
export const unavailable = (message: string, retryAfterSeconds: number) =>
  new HttpError(503, 'unavailable', message, undefined, retryAfterSeconds);
export const busy = (message: string, retryAfterSeconds: number) =>
  new HttpError(503, 'busy', message, undefined, retryAfterSeconds);
