// The single error handler, registered last: every failure leaves in the shape of docs/contracts.md §Errors.
import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import type { ApiErrorBody, ErrorCode } from '../../shared/schema/errors.ts';
import { isUniqueViolation, isUnstorableText } from '../dbErrors.ts';
import { HttpError } from '../errors.ts';

/**
 * Errors raised by body-parser carry an HTTP status and usually a type such as 'entity.parse.failed';
 * a body that fails to inflate (Content-Encoding: gzip that is not gzip) carries zlib's code instead.
 */
interface BodyParserError {
  status: number;
  type?: string;
  code?: string;
}
function isBodyParserError(err: unknown): err is BodyParserError {
  if (typeof err !== 'object' || err === null || typeof (err as { status?: unknown }).status !== 'number') return false;
  const { type, code } = err as { type?: unknown; code?: unknown };
  return typeof type === 'string' || (typeof code === 'string' && code.startsWith('Z_'));
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
    res
      .status(400)
      .json(body('validation_failed', `Invalid input (${where}${first?.message ?? 'invalid'})`, zodDetails(err)));
    return;
  }
  if (err instanceof HttpError) {
    if (err.retryAfterSeconds !== undefined) res.setHeader('Retry-After', String(err.retryAfterSeconds));
    res.status(err.status).json(body(err.code, err.message, err.details));
    return;
  }
  if (isBodyParserError(err) && err.status >= 400 && err.status < 500) {
    if (err.type === 'entity.too.large') {
      res.status(413).json(body('payload_too_large', 'The request body is too large'));
    } else if (err.type === 'entity.parse.failed') {
      res.status(400).json(body('bad_request', 'The request body is not valid JSON'));
    } else if (err.code?.startsWith('Z_')) {
      res
        .status(400)
        .json(
          body('bad_request', 'The request body could not be decompressed: it does not match its Content-Encoding'),
        );
    } else {
      res.status(err.status).json(body('bad_request', 'The request body could not be read'));
    }
    return;
  }
  if (isUniqueViolation(err)) {
    // A racing writer (often another process) saved the same name or code first.
    res.status(409).json(body('conflict', 'Someone else has just saved the same thing; reload and try again'));
    return;
  }
  if (isUnstorableText(err)) {
    res.status(400).json(body('bad_request', 'The text contains a character that cannot be stored (NUL)'));
    return;
  }
  req.log.error({ err }, 'unhandled error');
  res.status(500).json(body('internal', 'Something went wrong on the server'));
};
