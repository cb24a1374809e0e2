// Live channel events (docs/live-protocol.md): payload schemas and the typed Socket.IO event maps.
import { z } from 'zod';
import { opsSchema, type Op } from './ops.ts';
import type { StackDocument } from './stack.ts';
import type { StackResult } from './results.ts';
import type { ApiErrorBody } from './errors.ts';
import type { Level, Role } from './api.ts';
import type { BuildingModelChanged } from './building.ts';
import type { PositionResult } from './stackPositions.ts';

const stackId = z.number().int().positive();

export const stackJoinSchema = z.object({ stackId }).strict();
export const stackLeaveSchema = z.object({ stackId }).strict();
/** A client's own name for one edit, echoed in the edit's ack and its `stack:changed` (docs/live-protocol.md). */
export const editIdSchema = z
  .string()
  .min(1)
  .max(64)
  .regex(/^[A-Za-z0-9_-]+$/, 'letters, digits, - and _ only');
export const stackEditSchema = z
  .object({ stackId, baseVersion: z.number().int().min(0), ops: opsSchema, editId: editIdSchema.optional() })
  .strict();
export const stackSelectSchema = z.object({ stackId, nodeIds: z.array(z.string().max(64)).max(200) }).strict();
export const buildingJoinSchema = z.object({ buildingId: z.number().int().positive() }).strict();

export interface PresenceUser {
  userId: number;
  name: string;
  /** Node ids this person has selected. */
  selection: string[];
}

/** What joining a stack answers: everything the stack page needs, in one reply (docs/live-protocol.md). */
export interface StackJoinAck {
  doc: StackDocument;
  version: number;
  results: StackResult;
  name: string;
  buildingId: number;
  buildingName: string;
  /** The caller's role on the building (a site admin who is not a member reads as a viewer). */
  role: Role;
  /** The x line of the stack's place on the grid; null off the grid (docs/building-model.md). */
  gridX?: string | null;
  /** The building's levels, lowest first; they place the document's tied nodes (docs/contracts.md §Stack document). */
  levels: Level[];
}
/** What an accepted edit answers: its new version, and the edit's own id when it gave one. */
export interface StackEditAck {
  version: number;
  editId?: string;
}
export interface StackChanged {
  stackId: number;
  version: number;
  ops: Op[];
  results: StackResult;
  by: { userId: number; name: string };
  /** The building's levels after the change, when it moved a level (the document's tied nodes follow them). */
  levels?: Level[];
  /** The id the editing client gave the edit, when it gave one. */
  editId?: string;
}
export interface BuildingStackChanged {
  buildingId: number;
  stackId: number;
  version: number;
  utilisation: number | null;
  governingLiftId: string | null;
  governingLiftLabel: string | null;
  governingSection: string | null;
  status: 'passes' | 'fails' | 'errors';
  /** A typical column: each position's check and the one that governs (docs/typical-columns.md). */
  positions?: PositionResult[];
  governingPosition?: string;
}

/**
 * Several stacks of one building re-analysed by one change (a floor load, the grid, the building's options, an
 * import): their summaries in one message, in the order they were stored (docs/live-protocol.md).
 */
export interface BuildingStacksChanged {
  buildingId: number;
  stacks: BuildingStackChanged[];
}

/** A revision of the building was frozen, prepared, checked, commented on or approved (docs/issue-workflow.md). */
export interface BuildingRevisionChanged {
  buildingId: number;
  revisionId: number;
  by: { userId: number; name: string };
}

export interface SessionEnded {
  reason: 'expired' | 'signed-out';
  message: string;
}

export type Ack<T> = (res: { ok: true; data: T } | ({ ok: false } & ApiErrorBody)) => void;

export interface ClientToServerEvents {
  'stack:join': (payload: z.infer<typeof stackJoinSchema>, ack: Ack<StackJoinAck>) => void;
  'stack:leave': (payload: z.infer<typeof stackLeaveSchema>, ack?: Ack<null>) => void;
  'stack:edit': (payload: z.infer<typeof stackEditSchema>, ack: Ack<StackEditAck>) => void;
  'stack:select': (payload: z.infer<typeof stackSelectSchema>, ack?: Ack<null>) => void;
  'building:join': (payload: z.infer<typeof buildingJoinSchema>, ack: Ack<null>) => void;
}
export interface ServerToClientEvents {
  'stack:changed': (payload: StackChanged) => void;
  presence: (payload: { stackId: number; users: PresenceUser[] }) => void;
  'building:stack-changed': (payload: BuildingStackChanged) => void;
  'building:stacks-changed': (payload: BuildingStacksChanged) => void;
  'building:revision-changed': (payload: BuildingRevisionChanged) => void;
  /** The user lost access to a building: the server has taken this socket out of its rooms. */
  'access:revoked': (payload: { buildingId: number }) => void;
  /** The session behind this socket ended; the server closes the socket next (sign in again). */
  'session:ended': (payload: SessionEnded) => void;
  'building:model-changed': (payload: BuildingModelChanged) => void;
}
