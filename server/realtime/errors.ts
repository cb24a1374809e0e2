// Turns anything a live-channel handler throws into the error shape of docs/contracts.md §Errors, as an
// acknowledgement.
import { ZodError } from 'zod';
import type { Logger } from 'pino';
import type { ApiErrorBody } from '../../shared/schema/errors.ts';
import { HttpError } from '../errors.ts';

export function toErrorBody(err: unknown, log: Logger): ApiErrorBody {
  if (err instanceof ZodError) {
    const details = err.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
    const first = details[0];
    return {
      error: {
        code: 'validation_failed',
        message: first ? `${first.path || 'payload'}: ${first.message}` : 'Invalid payload',
        details,
      },
    };
  }
  if (err instanceof HttpError) {
    return {
      error: { code: err.code, message: err.message, ...(err.details === undefined ? {} : { details: err.details }) },
    };
  }
  log.error({ err }, 'live channel handler failed');
  return { error: { code: 'internal', message: 'Something went wrong on the server; the edit was not applied' } };
}
