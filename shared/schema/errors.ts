// The one error shape of the API and the live channel (docs/contracts.md §Errors).
import { z } from 'zod';

export const errorCodeSchema = z.enum([
  'bad_request',
  'validation_failed',
  'unauthenticated',
  'forbidden',
  'not_found',
  'conflict',
  'unprocessable',
  'payload_too_large',
  'rate_limited',
  'internal',
  'unavailable',
  'busy',
  'package_tampered',
  'package_missing',
]);
export type ErrorCode = z.infer<typeof errorCodeSchema>;

export const apiErrorSchema = z.object({
  error: z.object({ code: errorCodeSchema, message: z.string(), details: z.unknown().optional() }),
});
export type ApiErrorBody = z.infer<typeof apiErrorSchema>;
