// zod at the boundary: every body, parameter and query goes through one of these.
import type { Request } from 'express';
import { z } from 'zod';
import { idParamSchema } from '../../shared/schema/api.ts';
import { badRequest } from '../errors.ts';

export function parseBody<S extends z.ZodType>(schema: S, req: Request): z.infer<S> {
  return schema.parse(req.body);
}

export function parseQuery<S extends z.ZodType>(schema: S, req: Request): z.infer<S> {
  return schema.parse(req.query);
}

/** A positive integer route parameter such as :id; anything else is a 400 validation error. */
export function idParam(req: Request, name = 'id'): number {
  return z.object({ [name]: idParamSchema }).parse({ [name]: req.params[name] })[name];
}

/** A PATCH body with at least one field: an empty one would be a write that changes nothing. */
export function parsePatch<S extends z.ZodType<Record<string, unknown>>>(schema: S, req: Request): z.infer<S> {
  const body = schema.parse(req.body);
  if (Object.values(body).every((v) => v === undefined)) throw badRequest('Give at least one field to change');
  return body;
}
