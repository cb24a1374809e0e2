// Typical columns (docs/typical-columns.md): one stack's design standing at further crossings of the grid,
// each with its own floor loads. What the routes take and give, and what the results carry per position.
import { z } from 'zod';
import { areaOverrideSchema } from './building.ts';

const gridLineId = z
  .string()
  .trim()
  .min(1)
  .max(64)
  .regex(/^[A-Za-z0-9_.:-]+$/, 'may hold only letters, digits and _ . : -');

/** POST /api/stacks/:id/positions */
export const addStackPositionBodySchema = z
  .object({ gridX: gridLineId, gridY: gridLineId, webAlong: z.enum(['x', 'y']).default('x') })
  .strict();
export type AddStackPositionBody = z.infer<typeof addStackPositionBodySchema>;

const status = z.enum(['passes', 'fails', 'errors']);

/** One lift's check at one position. */
export const positionLiftSchema = z.object({
  liftId: z.string(),
  label: z.string(),
  utilisation: z.number(),
  governing: z.string(),
  /** kN, the design force at the bottom of the lift */
  NEd: z.number(),
});

/** The design checked at one position: `positionId` null is the stack's own place. */
export const positionResultSchema = z.object({
  positionId: z.number().int().nullable(),
  gridX: z.string(),
  gridY: z.string(),
  /** The crossing's name, `x name/y name`. */
  name: z.string(),
  /** m², the floor area the position carries, summed over the levels with a floor load. */
  area: z.number(),
  utilisation: z.number().nullable(),
  status,
  governingLiftId: z.string().nullable(),
  governingLiftLabel: z.string().nullable(),
  governingSection: z.string().nullable(),
  lifts: z.array(positionLiftSchema),
  errors: z.array(z.string()),
});
export type PositionResult = z.infer<typeof positionResultSchema>;

/** A further crossing a stack stands at, as the routes list it. */
export const stackPositionSchema = z.object({
  id: z.number().int(),
  stackId: z.number().int(),
  gridX: z.string(),
  gridY: z.string(),
  webAlong: z.enum(['x', 'y']),
  name: z.string(),
  /** The position's areas set by hand (voids, openings, cores), by level; none for the grid's areas everywhere. */
  overrides: z.array(areaOverrideSchema),
});
export type StackPosition = z.infer<typeof stackPositionSchema>;

/** GET/POST/DELETE /api/stacks/:id/positions and PUT …/:positionId/area-overrides: the further positions and, when analysed, every position's result. */
export const stackPositionsReplySchema = z.object({
  stackId: z.number().int(),
  version: z.number().int(),
  positions: z.array(stackPositionSchema),
  results: z.array(positionResultSchema),
  /** The name of the position whose check governs the type; null for a stack at one position. */
  governingPosition: z.string().nullable(),
});
export type StackPositionsReply = z.infer<typeof stackPositionsReplySchema>;

/** GET /api/buildings/:id/stack-positions: every typical column of the building, for the plan view. */
export const buildingPositionsReplySchema = z.object({
  buildingId: z.number().int(),
  stacks: z.array(
    z.object({
      stackId: z.number().int(),
      results: z.array(positionResultSchema),
      governingPosition: z.string().nullable(),
    }),
  ),
});
export type BuildingPositionsReply = z.infer<typeof buildingPositionsReplySchema>;
