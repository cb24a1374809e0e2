// The single error handler, registered last: every failure leaves in the shape of docs/contracts.md §Errors.
import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import type { ApiErrorBody, ErrorCode } from '../../shared/schema/errors.ts';
import { HttpError } from '../errors.ts';

/** Errors raised by body-parser carry an HTTP status and a type such as 'entity.parse.failed'. */
interface BodyParserError {
  status: number;
  type: string;
}
function isBodyParserError(err: unknown): err is BodyParserError {
  return (
    typeof err === 'object' && err !== null &&
    typeof (err as { status?: unknown }).status === 'number' &&
    typeof (err as { type?: unknown }).type === 'string'
  );
}

function body(code: ErrorCode, message: string, details?: unknown): ApiErrorBody {
  return details === undefined ? { error: { code, message } } : { error: { code, message, details } };
}

export function zodDetails(err: ZodError): { path: string; message: string }[] {
  return err.issues.map((i) => ({ path: i.path.map(String).join('.'), message: i.message }));
}

export const errorHandler: ErrorRequestHandler = (err: unknown, req, res, next) => {
  if (res.headersSent) {
    next(err);
    return;
  }
  if (err instanceof ZodError) {
    const first = err.issues[0];
    const where = first && first.path.length ? `${first.path.map(String).join('.')}: ` : '';
    res.status(400).json(body('validation_failed', `Invalid input (${where}${first?.message ?? 'invalid'})`, zodDetails(err)));
    return;
  }
  if (err instanceof HttpError) {
    res.status(err.status).json(body(err.code, err.message, err.details));
    return;
  }
  if (isBodyParserError(err) && err.status >= 400 && err.status < 500) {
    if (err.type === 'entity.too.large') {
      res.status(413).json(body('payload_too_large', 'The request body is too large'));
    } else if (err.type === 'entity.parse.failed') {
      res.status(400).json(body('bad_request', 'The request body is not valid JSON'));
    } else {
      res.status(err.status).json(body('bad_request', 'The request body could not be read'));
    }
    return;
  }
  req.log.error({ err }, 'unhandled error');
  res.status(500).json(body('internal', 'Something went wrong on the server'));
};
