// Text with a NUL character cannot be stored in PostgreSQL's text columns (SQLite would keep it and
// a later move to PostgreSQL would fail). Every JSON body is refused with a 400 naming the field when
// any string in it, or any key, holds one: one check for every route instead of one per schema.
// Stack documents travel inside JSON columns, where NUL is escaped, but they pass through here too.
import type { RequestHandler } from 'express';
import { badRequest } from '../errors.ts';

function findNul(value: unknown, path: string): string | null {
  if (typeof value === 'string') return value.includes('\u0000') ? path : null;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i += 1) {
      const found = findNul(value[i], `${path}.${i}`);
      if (found) return found;
    }
    return null;
  }
  if (typeof value === 'object' && value !== null) {
    for (const [k, v] of Object.entries(value)) {
      if (k.includes('\u0000')) return `${path}.(a key)`;
      const found = findNul(v, `${path}.${k}`);
      if (found) return found;
    }
  }
  return null;
}

export const refuseNul: RequestHandler = (req, _res, next) => {
  const where = findNul(req.body, 'body');
  if (where)
    throw badRequest(
      `${where.replace(/^body\.?/, '') || 'The body'} contains a NUL character, which cannot be stored`,
      { path: where },
    );
  next();
};
