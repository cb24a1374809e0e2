// What the REST API and the live channel answer (docs/contracts.md §Replies), as zod schemas the client
// parses every reply with. Each schema is typed by the interface it checks, so the two cannot drift: the
// interface stays the one declaration and the schema fails to compile when they disagree.
// Small records are checked field by field; the engine's deep output (results, comparisons, previews)
// is checked for its outer shape, since the engine that built it is the same code on both ends.
import { z } from 'zod';
import { positionResultSchema } from './stackPositions.ts';
import {
  roleSchema,
  type AuthResponse,
  type Building,
  type BuildingSummary,
  type Level,
  type LevelMovePreview,
  type Member,
  type PasswordStrength,
  type RegisterResponse,
  type StackDetail,
  type StackSummary,
  type User,
} from './api.ts';
import { analysisOptionsSchema, type StackResult } from './results.ts';
import { stackDocumentSchema } from './stack.ts';
import type {
  BuildingRevisionChanged,
  BuildingStackChanged,
  BuildingStacksChanged,
  StackChanged,
  StackJoinAck,
} from './socket.ts';
import { buildingModelSchema, type BuildingModelChanged, type BuildingModelReply, type Placement } from './building.ts';
import type { BuildingSizingPreview, StackSizingPreview } from './sizing.ts';
import type { RevisionComparison, RevisionDetail, RevisionSummary } from './revisions.ts';
import type { FloorLoadsPreview, GridPreview } from './imports.ts';
import type { StackAsOf, StackHistory } from '../history/historyTypes.ts';
import type { ColumnSchedule } from '../schedule/columnSchedule.ts';
import type { RobustnessSummary } from '../engine/connections/robustnessSummary.ts';

/** A reply checked for the fields named (extra fields pass), typed as the interface it is. */
export function outlineOf<T>(shape: z.ZodRawShape): z.ZodType<T> {
  const outline = z.looseObject(shape);
  return z.custom<T>((value) => outline.safeParse(value).success, 'the reply does not have the expected shape');
}

const id = z.number().int();
const isoTime = z.string();
const nullableNumber = z.number().nullable();
const by = z.object({ userId: id, name: z.string() });
const stackStatus = z.enum(['passes', 'fails', 'errors']);
const webAlong = z.enum(['x', 'y']);

// Accounts
export const userSchema: z.ZodType<User> = z.object({
  id,
  email: z.string(),
  name: z.string(),
  isAdmin: z.boolean(),
  emailVerified: z.boolean(),
});
export const authResponseSchema: z.ZodType<AuthResponse> = z.object({ token: z.string(), user: userSchema });
export const registerResponseSchema: z.ZodType<RegisterResponse> = z.object({
  status: z.literal('verification-sent'),
  email: z.string(),
});
export const passwordStrengthSchema: z.ZodType<PasswordStrength> = z.object({
  score: z.number(),
  required: z.number(),
  acceptable: z.boolean(),
  warning: z.string().nullable(),
  suggestions: z.array(z.string()),
});

// Buildings, members, levels
export const buildingSummarySchema = z.object({
  id,
  name: z.string(),
  reference: z.string(),
  role: roleSchema,
  stackCount: z.number(),
  worstUtilisation: nullableNumber,
  updatedAt: isoTime,
}) satisfies z.ZodType<BuildingSummary>;
export const buildingSchema: z.ZodType<Building> = buildingSummarySchema.extend({ options: analysisOptionsSchema });
export const memberSchema: z.ZodType<Member> = z.object({
  userId: id.nullable(),
  email: z.string(),
  name: z.string().nullable(),
  role: roleSchema,
  pending: z.boolean(),
  expiresAt: isoTime.optional(),
  invitationMail: z
    .object({ status: z.enum(['pending', 'sent', 'failed']), attempts: z.number(), error: z.string().nullable() })
    .optional(),
});
export const levelSchema: z.ZodType<Level> = z.object({ id: z.string(), name: z.string(), elevation: z.number() });
export const levelMovePreviewSchema: z.ZodType<LevelMovePreview> = z.object({
  elevation: z.number(),
  stacks: z.array(
    z.object({ stackId: id, name: z.string(), nodes: z.number(), splices: z.number(), breaks: z.array(z.string()) }),
  ),
});

// Stacks
export const stackResultSchema = outlineOf<StackResult>({
  errors: z.array(z.unknown()),
  warnings: z.array(z.unknown()),
  lifts: z.array(z.unknown()),
  governingLiftId: z.string().nullable(),
  takeDown: z.array(z.unknown()),
});
const grid = { gridX: z.string().nullable().optional(), gridY: z.string().nullable().optional() };
export const stackSummarySchema: z.ZodType<StackSummary> = z.object({
  id,
  buildingId: id,
  name: z.string(),
  version: id,
  liftCount: z.number(),
  governingLiftId: z.string().nullable(),
  governingLiftLabel: z.string().nullable(),
  governingSection: z.string().nullable(),
  utilisation: nullableNumber,
  status: stackStatus,
  updatedAt: isoTime,
  ...grid,
  webAlong: webAlong.optional(),
});
export const createdStackSchema = z.object({ id, name: z.string() });
export const stackDetailSchema: z.ZodType<StackDetail> = z.object({
  id,
  buildingId: id,
  name: z.string(),
  doc: stackDocumentSchema,
  version: id,
  results: stackResultSchema,
  ...grid,
  webAlong: webAlong.optional(),
});
export const stackHistorySchema = outlineOf<StackHistory>({ entries: z.array(z.unknown()), complete: z.boolean() });
export const stackAsOfSchema = outlineOf<StackAsOf>({ version: id, doc: z.unknown(), outline: z.array(z.unknown()) });
export const opsReplySchema = z.looseObject({ version: id });

// The live channel
export const stackJoinAckSchema: z.ZodType<StackJoinAck> = z.object({
  doc: stackDocumentSchema,
  version: id,
  results: stackResultSchema,
  name: z.string(),
  buildingId: id,
  buildingName: z.string(),
  role: roleSchema,
  gridX: z.string().nullable().optional(),
  levels: z.array(levelSchema),
});
export const stackEditAckSchema = z.object({ version: id, editId: z.string().optional() });
export const stackChangedSchema = outlineOf<StackChanged>({
  stackId: id,
  version: id,
  ops: z.array(z.unknown()),
  results: stackResultSchema,
  by,
  editId: z.string().optional(),
});

export const buildingStackChangedSchema: z.ZodType<BuildingStackChanged> = z.object({
  buildingId: id,
  stackId: id,
  version: id,
  utilisation: nullableNumber,
  governingLiftId: z.string().nullable(),
  governingLiftLabel: z.string().nullable(),
  governingSection: z.string().nullable(),
  status: stackStatus,
  positions: z.array(positionResultSchema).optional(),
  governingPosition: z.string().optional(),
});
export const buildingStacksChangedSchema: z.ZodType<BuildingStacksChanged> = z.object({
  buildingId: id,
  stacks: z.array(buildingStackChangedSchema),
});
export const buildingRevisionChangedSchema: z.ZodType<BuildingRevisionChanged> = z.object({
  buildingId: id,
  revisionId: id,
  by,
});
export const buildingModelChangedSchema = outlineOf<BuildingModelChanged>({
  buildingId: id,
  version: id,
  model: z.looseObject({ grid: z.unknown(), buildups: z.array(z.unknown()), floors: z.array(z.unknown()) }),
  by,
});

// The building model
export const buildingModelReplySchema: z.ZodType<BuildingModelReply> = buildingModelSchema
  .extend({ version: id })
  .loose();
export const placementSchema: z.ZodType<Placement> = z.object({
  id,
  name: z.string(),
  gridX: z.string().nullable(),
  gridY: z.string().nullable(),
  webAlong,
});
export const modelCsvPreviewSchema = outlineOf<GridPreview | FloorLoadsPreview>({
  fileHash: z.string(),
  rows: z.array(z.unknown()),
  problems: z.array(z.unknown()),
});

// Building-wide figures
export const columnScheduleSchema = outlineOf<ColumnSchedule>({
  rows: z.array(z.unknown()),
  types: z.array(z.unknown()),
  gaps: z.array(z.unknown()),
  note: z.string(),
});
export const robustnessSummarySchema = outlineOf<RobustnessSummary>({
  tiesRequired: z.boolean(),
  meeting: z.array(z.unknown()),
  notMeeting: z.array(z.unknown()),
  message: z.string(),
});
export const stackSizingPreviewSchema = outlineOf<StackSizingPreview>({
  stackId: id,
  version: id,
  lifts: z.array(z.unknown()),
  errors: z.array(z.unknown()),
});
export const buildingSizingPreviewSchema = outlineOf<BuildingSizingPreview>({
  buildingId: id,
  stacks: z.array(z.unknown()),
});

// Revisions
export const revisionSummarySchema = outlineOf<RevisionSummary>({
  id,
  buildingId: id,
  code: z.string(),
  frozenAt: isoTime,
  hash: z.string(),
  mail: z.object({ pending: z.number(), sent: z.number(), failed: z.number() }),
});
export const revisionDetailSchema = outlineOf<RevisionDetail>({
  id,
  code: z.string(),
  stacks: z.array(z.unknown()),
  recipients: z.array(z.unknown()),
});
export const revisionComparisonSchema = outlineOf<RevisionComparison>({
  from: z.looseObject({ code: z.string() }),
  to: z.looseObject({ code: z.string() }),
  stacks: z.array(z.unknown()),
});
