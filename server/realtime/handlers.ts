// Live-channel events (docs/live-protocol.md). Every payload is parsed with zod and every event checks the
// caller's role on the stack's building, exactly as the REST routes do.
import type { ZodType } from 'zod';
import type { Logger } from 'pino';
import type { Role } from '../../shared/schema/api.ts';
import {
  buildingJoinSchema,
  stackEditSchema,
  stackJoinSchema,
  stackLeaveSchema,
  stackSelectSchema,
  type Ack,
} from '../../shared/schema/socket.ts';
import type { ServerContext } from '../context.ts';
import { forbidden } from '../errors.ts';
import { checkAccess } from '../services/accessPolicy.ts';
import { editStack } from '../services/stackOps.ts';
import { openStack } from '../services/stacks.ts';
import { toErrorBody } from './errors.ts';
import { broadcastPresence, buildingRoom, stackRoom } from './presence.ts';
import { assertSessionLive } from './session.ts';
import type { LiveServer, LiveSocket } from './types.ts';

/** The one access policy, as REST applies it (services/accessPolicy.ts), for the socket's user. */
async function accessTo(
  ctx: ServerContext,
  socket: LiveSocket,
  buildingId: number | null,
  what: string,
  minRole: Role,
): Promise<void> {
  await checkAccess(ctx.db, socket.data.user, buildingId, what, minRole);
}

async function buildingOfStack(ctx: ServerContext, stackId: number): Promise<number | null> {
  const row = await ctx.db('stacks').where({ id: stackId }).first<{ building_id: number } | undefined>('building_id');
  return row ? row.building_id : null;
}

async function buildingExists(ctx: ServerContext, buildingId: number): Promise<number | null> {
  const row = await ctx.db('buildings').where({ id: buildingId }).first('id');
  return row ? buildingId : null;
}

/**
 * Wraps a handler: checks the socket's session is still live (not expired, not signed out), validates
 * the payload, runs it, and answers through the acknowledgement with
 * `{ ok: true, data }` or the error shape. A client that sends no acknowledgement is still served.
 */
function handle<S extends ZodType, T>(
  guard: () => Promise<void>,
  log: Logger,
  schema: S,
  run: (payload: ReturnType<S['parse']>) => Promise<T>,
) {
  return async (raw: unknown, ack?: unknown): Promise<void> => {
    const reply = typeof ack === 'function' ? (ack as Ack<T>) : () => undefined;
    try {
      await guard();
      reply({ ok: true, data: await run(schema.parse(raw) as ReturnType<S['parse']>) });
    } catch (err) {
      reply({ ok: false, ...toErrorBody(err, log) });
    }
  };
}

export function registerHandlers(ctx: ServerContext, io: LiveServer, socket: LiveSocket, log: Logger): void {
  const user = socket.data.user;
  const live = () => assertSessionLive(ctx, socket);

  socket.on(
    'stack:join',
    handle(live, log, stackJoinSchema, async ({ stackId }) => {
      const buildingId = await buildingOfStack(ctx, stackId);
      const role = await checkAccess(ctx.db, user, buildingId, 'Stack', 'viewer');
      const opened = await openStack(ctx.db, stackId, role);
      await socket.join(stackRoom(stackId));
      socket.data.selections = { ...socket.data.selections, [stackId]: socket.data.selections[stackId] ?? [] };
      void broadcastPresence(io, stackId).catch((err: unknown) => log.warn({ err }, 'presence update failed'));
      return opened;
    }),
  );

  socket.on(
    'stack:leave',
    handle(live, log, stackLeaveSchema, async ({ stackId }) => {
      await socket.leave(stackRoom(stackId));
      const { [stackId]: _left, ...rest } = socket.data.selections;
      socket.data.selections = rest;
      await broadcastPresence(io, stackId);
      return null;
    }),
  );

  socket.on(
    'stack:edit',
    handle(live, log, stackEditSchema, async ({ stackId, baseVersion, ops, editId }) => {
      // Checked on every edit, not only at join: a role can be lowered while the socket is open.
      await accessTo(ctx, socket, await buildingOfStack(ctx, stackId), 'Stack', 'engineer');
      const change = await editStack(ctx, { stackId, baseVersion, ops }, user, editId);
      return editId ? { version: change.version, editId } : { version: change.version };
    }),
  );

  socket.on(
    'stack:select',
    handle(live, log, stackSelectSchema, async ({ stackId, nodeIds }) => {
      if (!socket.rooms.has(stackRoom(stackId))) throw forbidden('Join the stack before selecting in it');
      // Presence goes to everyone in the room: the sender must still be allowed to read the stack.
      await accessTo(ctx, socket, await buildingOfStack(ctx, stackId), 'Stack', 'viewer');
      socket.data.selections = { ...socket.data.selections, [stackId]: [...new Set(nodeIds)] };
      await broadcastPresence(io, stackId);
      return null;
    }),
  );

  socket.on(
    'building:join',
    handle(live, log, buildingJoinSchema, async ({ buildingId }) => {
      await accessTo(ctx, socket, await buildingExists(ctx, buildingId), 'Building', 'viewer');
      await socket.join(buildingRoom(buildingId));
      return null;
    }),
  );

  socket.on('disconnecting', () => {
    const stacks = [...socket.rooms].filter((r) => r.startsWith('stack:')).map((r) => Number(r.slice('stack:'.length)));
    // Presence is recomputed once the socket has actually left its rooms.
    socket.once('disconnect', () => {
      for (const stackId of stacks)
        void broadcastPresence(io, stackId).catch((err: unknown) => log.warn({ err }, 'presence update failed'));
    });
  });
}
