// A socket lives only as long as the session that opened it (docs/access.md): it is closed when its token
// expires, and every event first checks the token has not expired and the user's session version has not
// moved on (sign-out everywhere, password change).
import type { ServerContext } from '../context.ts';
import { unauthenticated } from '../errors.ts';
import { tokenVersionOf } from '../services/users.ts';
import type { LiveSocket } from './types.ts';

const MESSAGES = {
  expired: 'Your session has expired; sign in again',
  'signed-out': 'This session has ended (signed out or password changed); sign in again',
} as const;

/** Tells the client why, then closes the socket. */
export function endSession(socket: LiveSocket, reason: keyof typeof MESSAGES): void {
  if (socket.disconnected) return;
  socket.emit('session:ended', { reason, message: MESSAGES[reason] });
  socket.disconnect(true);
}

/** Throws 401 (and closes the socket once the reply is sent) when the socket's session is over. */
export async function assertSessionLive(ctx: ServerContext, socket: LiveSocket): Promise<void> {
  let reason: keyof typeof MESSAGES | null = null;
  if (Date.now() >= socket.data.expiresAt) reason = 'expired';
  else if ((await tokenVersionOf(ctx.db, socket.data.user.id).catch(() => -1)) !== socket.data.tokenVersion)
    reason = 'signed-out';
  if (reason === null) return;
  const why = reason;
  // After the acknowledgement carrying the refusal has gone out.
  setImmediate(() => endSession(socket, why));
  throw unauthenticated(MESSAGES[why]);
}
