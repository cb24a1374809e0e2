// Who is asking: the bearer token becomes req.user, or the request is refused with 401.
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Role, User } from '../../shared/schema/api.ts';
import type { ServerContext } from '../context.ts';
import { forbidden, unauthenticated } from '../errors.ts';
import { verifySession } from '../services/tokens.ts';
import { userForSession } from '../services/users.ts';

/** The caller's rights on the building a route is about (set by requireRole). */
export interface BuildingAccess {
  buildingId: number;
  /** null for a site admin reading a building they are not a member of. */
  role: Role | null;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace -- Express types its Request through this global namespace
  namespace Express {
    interface Request {
      user?: User;
      access?: BuildingAccess;
    }
  }
}

export function bearerToken(header: string | undefined): string | null {
  const match = /^Bearer\s+(\S+)$/i.exec(header ?? '');
  return match ? match[1] : null;
}

export function requireAuth(ctx: ServerContext): RequestHandler {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const token = bearerToken(req.headers.authorization);
    if (!token) throw unauthenticated();
    // The session version is checked on every request: signing out or a password change ends older tokens.
    const { tokenVersion: _version, ...user } = await userForSession(
      ctx.db,
      verifySession(ctx.config.jwtSecret, token),
    );
    req.user = user;
    next();
  };
}

export function requireAdmin(req: Request, _res: Response, next: NextFunction): void {
  if (!currentUser(req).isAdmin) throw forbidden('Only a site admin may do this');
  next();
}

export function currentUser(req: Request): User {
  if (!req.user) throw unauthenticated();
  return req.user;
}

export function currentAccess(req: Request): BuildingAccess {
  if (!req.access) throw new Error('requireRole must run before this handler');
  return req.access;
}
