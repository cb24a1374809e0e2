// Edit operations on a stack document (docs/contracts.md §Edits). Shared by the REST write and the live channel.
import { z } from 'zod';
import { elevationSchema, nodeIdSchema, stackEdgeSchema, stackNodeSchema } from './stack.ts';

export const opSchema = z.discriminatedUnion('op', [
  z.object({ op: z.literal('addNode'), node: stackNodeSchema }).strict(),
  // Shallow merge into the node's data; the merged data is validated against the node kind's schema. An
  // elevation outside the building range is refused here already, as malformed input (400).
  z
    .object({
      op: z.literal('updateNode'),
      id: nodeIdSchema,
      data: z.looseObject({ elevation: elevationSchema.optional() }),
    })
    .strict(),
  z
    .object({
      op: z.literal('moveNode'),
      id: nodeIdSchema,
      position: z.object({ x: z.number().finite(), y: z.number().finite() }).strict(),
    })
    .strict(),
  z.object({ op: z.literal('removeNode'), id: nodeIdSchema }).strict(),
  z.object({ op: z.literal('addEdge'), edge: stackEdgeSchema }).strict(),
  z.object({ op: z.literal('removeEdge'), id: nodeIdSchema }).strict(),
]);
export const opsSchema = z.array(opSchema).min(1).max(500);

export type Op = z.infer<typeof opSchema>;
