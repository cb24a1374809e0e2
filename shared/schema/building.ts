// The building model (docs/building-model.md): the grid, floor loads by area and the tributary-area
// overrides from which the loads of every stack on the grid are derived. Units: m, kN/m², kN/m.
import { z } from 'zod';
import { categorySchema } from './stack.ts';

const finite = z.number().refine(Number.isFinite, 'must be a finite number');
/** Largest plan coordinate we accept (m): a guard against absurd input, not a design limit. */
export const MAX_PLAN_M = 10_000;
/** Largest area load (kN/m²) or line load (kN/m) we accept: a guard, not a design limit. */
export const MAX_AREA_LOAD = 1000;
export const MAX_GRID_LINES = 200;

const id = z
  .string()
  .trim()
  .min(1)
  .max(64)
  .regex(/^[A-Za-z0-9_.:-]+$/, 'may hold only letters, digits and _ . : -');
const label = z.string().trim().min(1).max(60);
const areaLoad = finite.min(0, 'must not be negative').max(MAX_AREA_LOAD);

export const gridLineSchema = z
  .object({ id, name: z.string().trim().min(1).max(20), position: finite.min(-MAX_PLAN_M).max(MAX_PLAN_M) })
  .strict();

/**
 * One family of grid lines. `x` lines stand at positions along plan x (named A, B, C… by custom), `y` lines
 * at positions along plan y (1, 2, 3…). The floor runs `edgeBefore` beyond the first line and `edgeAfter`
 * beyond the last: the cantilever or slab edge that edge and corner columns carry.
 */
export const gridDirectionSchema = z
  .object({
    lines: z.array(gridLineSchema).max(MAX_GRID_LINES),
    edgeBefore: finite.min(0).max(100).default(0),
    edgeAfter: finite.min(0).max(100).default(0),
  })
  .strict();

export const gridSchema = z
  .object({ x: gridDirectionSchema, y: gridDirectionSchema })
  .strict()
  .superRefine((grid, ctx) => {
    const ids = new Set<string>();
    for (const dir of ['x', 'y'] as const) {
      const names = new Set<string>();
      const positions: number[] = [];
      grid[dir].lines.forEach((line, i) => {
        const path = [dir, 'lines', i];
        if (ids.has(line.id))
          ctx.addIssue({ code: 'custom', path: [...path, 'id'], message: `is used by another grid line (${line.id})` });
        ids.add(line.id);
        const key = line.name.toLowerCase();
        if (names.has(key))
          ctx.addIssue({ code: 'custom', path: [...path, 'name'], message: `${line.name} names two ${dir} lines` });
        names.add(key);
        // Grid positions print to the millimetre, so two lines closer than that cannot be told apart.
        if (positions.some((p) => Math.abs(p - line.position) < 0.001)) {
          ctx.addIssue({
            code: 'custom',
            path: [...path, 'position'],
            message: `${line.name} is at the position of another ${dir} line`,
          });
        }
        positions.push(line.position);
      });
    }
  });

export const permanentItemSchema = z.object({ label, gk: areaLoad }).strict();

/**
 * An allowance for partitions (kN/m²). EN 1991-1-1 6.3.1.2(8) treats movable partitions as a uniformly
 * distributed imposed load; fixed partitions are permanent (EN 1991-1-1 5.1(2), from memory).
 */
export const partitionsSchema = z.object({ load: areaLoad, as: z.enum(['imposed', 'permanent']) }).strict();

/** A named floor build-up, reusable across levels. */
export const buildupSchema = z
  .object({
    id,
    name: label,
    permanent: z.array(permanentItemSchema).max(20),
    imposed: z.object({ qk: areaLoad, category: categorySchema }).strict(),
    partitions: partitionsSchema.optional(),
  })
  .strict();

/** A line load along a grid line at the edge of the floor (cladding, parapets), kN/m. */
export const lineLoadSchema = z.object({ gridLineId: id, label, gk: areaLoad, qk: areaLoad.default(0) }).strict();

/**
 * How the floor reaches the column: along the beams that frame into it. 'x': beams along plan x, into
 * the faces that look along ±x; 'y': beams along plan y; 'two-way': half of each bay each way.
 */
export const floorSpanSchema = z.enum(['two-way', 'x', 'y']);

export const floorLoadSchema = z
  .object({
    levelId: id,
    buildupId: id,
    span: floorSpanSchema.default('two-way'),
    lines: z.array(lineLoadSchema).max(20).default([]),
  })
  .strict();

/** A stack's area at one level set by hand (voids, openings, cores): an area in m² or a factor on the grid's. */
export const areaOverrideSchema = z
  .object({
    levelId: id,
    area: finite.min(0).max(1e5).optional(),
    factor: finite.min(0).max(10).optional(),
    reason: z.string().trim().min(1, 'say why the area differs from the grid').max(200),
  })
  .strict()
  .refine((o) => (o.area === undefined) !== (o.factor === undefined), 'give either an area or a factor, not both');

export type GridLine = z.infer<typeof gridLineSchema>;
export type GridDirection = z.infer<typeof gridDirectionSchema>;
export type Grid = z.infer<typeof gridSchema>;
export type PermanentItem = z.infer<typeof permanentItemSchema>;
export type Buildup = z.infer<typeof buildupSchema>;
export type LineLoad = z.infer<typeof lineLoadSchema>;
export type FloorSpan = z.infer<typeof floorSpanSchema>;
export type FloorLoad = z.infer<typeof floorLoadSchema>;
export type AreaOverride = z.infer<typeof areaOverrideSchema>;

export const EMPTY_GRID: Grid = {
  x: { lines: [], edgeBefore: 0, edgeAfter: 0 },
  y: { lines: [], edgeBefore: 0, edgeAfter: 0 },
};

/** Where a stack stands: on the crossing of an x line and a y line; `webAlong` says how its web runs in plan. */
export const stackPlacementSchema = z
  .object({ gridX: id.nullable(), gridY: id.nullable(), webAlong: z.enum(['x', 'y']).default('x') })
  .strict()
  .refine(
    (p) => (p.gridX === null) === (p.gridY === null),
    'give both grid lines, or neither to take the stack off the grid',
  );
export type StackPlacement = z.infer<typeof stackPlacementSchema>;

/**
 * The key of a further position's areas set by hand in `BuildingModel.overrides` (docs/typical-columns.md):
 * `p` and the position id, which no stack id (digits alone) can ever be.
 */
export const positionOverridesKey = (positionId: number): string => `p${positionId}`;

/** A crossing's name as people read it, `x name/y name`; null when the grid has no such lines. */
export function gridRef(grid: Grid, gridX: string, gridY: string): string | null {
  const x = grid.x.lines.find((l) => l.id === gridX);
  const y = grid.y.lines.find((l) => l.id === gridY);
  return x && y ? `${x.name}/${y.name}` : null;
}

/** A key of `BuildingModel.overrides`: a stack id, or `p` and a position id. */
export const overridesKeySchema = z.string().regex(/^p?[1-9][0-9]{0,15}$/, 'must be a stack id or p and a position id');

/** The whole model of a building, as the analysis and a frozen revision hold it. */
export interface BuildingModel {
  grid: Grid;
  buildups: Buildup[];
  floors: FloorLoad[];
  /** By stack id (as a string), and by `p<position id>` for a further position of a typical column. */
  overrides: Record<string, AreaOverride[]>;
}
export const EMPTY_MODEL: BuildingModel = { grid: EMPTY_GRID, buildups: [], floors: [], overrides: {} };

export const buildingModelSchema = z
  .object({
    grid: gridSchema,
    buildups: z.array(buildupSchema).max(100),
    floors: z.array(floorLoadSchema).max(500),
    overrides: z.record(overridesKeySchema, z.array(areaOverrideSchema).max(500)),
  })
  .strict();

// Request bodies
export const putGridBodySchema = z.object({ grid: gridSchema }).strict();
export const putBuildupsBodySchema = z
  .object({ buildups: z.array(buildupSchema).max(100) })
  .strict()
  .superRefine((body, ctx) => {
    const ids = new Set<string>();
    const names = new Set<string>();
    body.buildups.forEach((b, i) => {
      if (ids.has(b.id))
        ctx.addIssue({ code: 'custom', path: ['buildups', i, 'id'], message: `is used by another build-up (${b.id})` });
      if (names.has(b.name.toLowerCase()))
        ctx.addIssue({ code: 'custom', path: ['buildups', i, 'name'], message: `${b.name} names two build-ups` });
      ids.add(b.id);
      names.add(b.name.toLowerCase());
    });
  });
export const putFloorLoadBodySchema = z
  .object({
    buildupId: id.nullable(),
    span: floorSpanSchema.default('two-way'),
    lines: z.array(lineLoadSchema).max(20).default([]),
  })
  .strict();
export const putAreaOverridesBodySchema = z.object({ overrides: z.array(areaOverrideSchema).max(500) }).strict();

/** GET /api/buildings/:id/model */
export interface BuildingModelReply extends BuildingModel {
  version: number;
}

/** Where a stack stands, as lists and the live channel carry it. */
export interface Placement {
  id: number;
  name: string;
  gridX: string | null;
  gridY: string | null;
  webAlong: 'x' | 'y';
}

/** Socket: the building's model changed (grid, build-ups, floor loads or overrides), or a stack was placed. */
export interface BuildingModelChanged {
  buildingId: number;
  version: number;
  model: BuildingModel;
  by: { userId: number; name: string };
  /** Every stack's place, when the change moved or renamed stacks. */
  placements?: Placement[];
}
