// The stack document (docs/contracts.md §Stack document): the contract between the editor, the server and the engine.
// Units: metres and kilonewtons. Positions are for drawing only; the analysis never reads them.
import { z } from 'zod';

/**
 * Elevations a building has (m), for its levels and every node of its stacks alike: from below a deep basement
 * to above the tallest towers (common practice, no source). Anything outside is a typing error, refused (400)
 * with the range in the message.
 */
export const ELEVATION_RANGE_M = { min: -100, max: 1000 } as const;
/** Largest elevation or load we accept: a guard against absurd input, not a design limit. */
export const MAX_ELEVATION_M = ELEVATION_RANGE_M.max;
export const MAX_LOAD_KN = 1e6;
export const MAX_DIMENSION_MM = 5000;

const finite = z.number().refine(Number.isFinite, 'must be a finite number');
/** An elevation in the building range (docs/contracts.md §Stack document). */
export const elevationSchema = finite
  .min(ELEVATION_RANGE_M.min, `must be at least \u2212${-ELEVATION_RANGE_M.min} m: no building goes deeper`)
  .max(ELEVATION_RANGE_M.max, `must be at most +${ELEVATION_RANGE_M.max} m: no building stands that tall`);
const elevation = elevationSchema;
const load = finite.min(0, 'must not be negative').max(MAX_LOAD_KN);
const mm = finite.positive('must be greater than zero').max(MAX_DIMENSION_MM);

export const fixitySchema = z.enum(['pinned', 'partial', 'fixed']);
export const categorySchema = z.enum(['A', 'B', 'C', 'D', 'E', 'H']);
export const gradeSchema = z.enum(['S235', 'S275', 'S355', 'S420', 'S460']);
export const axesSchema = z.enum(['both', 'y', 'z']);

export const sectionDimsSchema = z.discriminatedUnion('shape', [
  z
    .object({
      shape: z.literal('I'),
      make: z.enum(['rolled', 'welded']),
      h: mm,
      b: mm,
      tw: mm,
      tf: mm,
      r: finite.min(0).max(MAX_DIMENSION_MM),
    })
    .strict(),
  z.object({ shape: z.literal('RHS'), make: z.enum(['hot-finished', 'cold-formed']), h: mm, b: mm, t: mm }).strict(),
  z.object({ shape: z.literal('CHS'), make: z.enum(['hot-finished', 'cold-formed']), d: mm, t: mm }).strict(),
]);

const sectionRef = z.union([z.string().trim().min(1).max(80), sectionDimsSchema]);
const kFactor = finite.positive().max(10);

/** A building level a node sits on (docs/contracts.md §Stack document): its elevation then follows the level's. */
const levelId = z.string().min(1).max(64).optional();
/** Bolt diameters and property classes a splice detail may use (EN 1993-1-8 Table 3.1). */
export const boltDiameterSchema = z.union([
  z.literal(12),
  z.literal(16),
  z.literal(20),
  z.literal(22),
  z.literal(24),
  z.literal(27),
  z.literal(30),
  z.literal(36),
]);
export const boltClassSchema = z.enum(['8.8', '10.9']);
export const concreteClassSchema = z.enum(['C20/25', 'C25/30', 'C30/37', 'C35/45', 'C40/50', 'C45/55', 'C50/60']);
/**
 * A flange cover-plate splice (see docs/splices-and-bases.md): one plate on the outside of each flange,
 * `bolts.number` bolts through each flange on each side of the joint. Optional, so older documents stay valid.
 */
export const spliceDetailSchema = z
  .object({
    plate: z.object({ width: mm, thickness: mm, grade: gradeSchema }).strict(),
    bolts: z
      .object({ number: z.number().int().min(1).max(40), diameter: boltDiameterSchema, class: boltClassSchema })
      .strict(),
  })
  .strict();
/** A base plate on a grout joint (EN 1993-1-8 6.2.5): b across the flanges, l along the depth (mm). */
export const basePlateSchema = z
  .object({ b: mm, l: mm, t: mm, grade: gradeSchema, grout: finite.min(0).max(MAX_DIMENSION_MM) })
  .strict();
export const supportDataSchema = z
  .object({ elevation, levelId, fixity: fixitySchema, basePlate: basePlateSchema.optional() })
  .strict();
/**
 * Whether the engineer has chosen the lift's section: 'not-chosen' for a lift added with a placeholder
 * (the analysis refuses it), 'to-confirm' for a section copied when a lift was split (flagged until
 * confirmed). Absent means chosen, so older documents stay valid.
 */
export const sectionStatusSchema = z.enum(['chosen', 'to-confirm', 'not-chosen']);
export const liftDataSchema = z
  .object({
    section: sectionRef,
    grade: gradeSchema,
    kY: kFactor.optional(),
    kZ: kFactor.optional(),
    note: z.string().max(500).optional(),
    sectionStatus: sectionStatusSchema.optional(),
  })
  .strict();
export const spliceDataSchema = z.object({ elevation, detail: spliceDetailSchema.optional() }).strict();
/** Characteristic beam reaction on one face of the column (kN). */
export const faceReactionSchema = z.object({ Gk: load, Qk: load }).strict();
/**
 * How the floor load at a restraint splits between the faces of the column, for the nominal moments of
 * simple construction: y faces are the flanges (moment about y-y), z faces the web (moment about z-z).
 * Optional, so older documents stay valid. The restraint's own Gk/Qk remain the total entering the column.
 */
export const restraintFacesSchema = z
  .object({
    yPlus: faceReactionSchema.optional(),
    yMinus: faceReactionSchema.optional(),
    zPlus: faceReactionSchema.optional(),
    zMinus: faceReactionSchema.optional(),
  })
  .strict();
/**
 * On a stack placed on the building's grid, a level with floor loads gives the loads of the restraint or
 * cap on it (docs/building-model.md); true keeps the Gk, Qk, category and faces written here instead.
 */
const loadsByHand = z.boolean().optional();
/** What a restraint and the cap both carry: the floor's loads at their point and the beams on their faces. */
const carried = {
  Gk: load,
  Qk: load,
  category: categorySchema,
  faces: restraintFacesSchema.optional(),
  loadsByHand,
};
export const restraintDataSchema = z
  .object({ elevation, levelId, axes: axesSchema, fixity: fixitySchema, ...carried })
  .strict();
/** `faces`: roof beams on the cap's faces, as on a restraint; optional, so older documents stay valid. */
export const capDataSchema = z
  .object({ elevation, levelId, fixity: z.union([fixitySchema, z.literal('free')]), ...carried })
  .strict();
export const loadDataSchema = z
  .object({ label: z.string().max(120), Gk: load, Qk: load, category: categorySchema })
  .strict();

export const nodeIdSchema = z
  .string()
  .min(1)
  .max(64)
  .regex(/^[A-Za-z0-9_.:-]+$/, 'may hold only letters, digits and _ . : -');
const positionSchema = z.object({ x: finite.min(-1e6).max(1e6), y: finite.min(-1e6).max(1e6) }).strict();
const nodeBase = { id: nodeIdSchema, position: positionSchema.optional() };

export const stackNodeSchema = z.discriminatedUnion('kind', [
  z.object({ ...nodeBase, kind: z.literal('support'), data: supportDataSchema }).strict(),
  z.object({ ...nodeBase, kind: z.literal('lift'), data: liftDataSchema }).strict(),
  z.object({ ...nodeBase, kind: z.literal('splice'), data: spliceDataSchema }).strict(),
  z.object({ ...nodeBase, kind: z.literal('restraint'), data: restraintDataSchema }).strict(),
  z.object({ ...nodeBase, kind: z.literal('cap'), data: capDataSchema }).strict(),
  z.object({ ...nodeBase, kind: z.literal('load'), data: loadDataSchema }).strict(),
]);

export const stackEdgeSchema = z.object({ id: nodeIdSchema, source: nodeIdSchema, target: nodeIdSchema }).strict();

/** Shape of a document. Its meaning (one chain, rising elevations…) is checked by validateStack in the engine. */
export const stackDocumentSchema = z
  .object({ nodes: z.array(stackNodeSchema).max(2000), edges: z.array(stackEdgeSchema).max(4000) })
  .strict();

export type Fixity = z.infer<typeof fixitySchema>;
export type Category = z.infer<typeof categorySchema>;
export type Grade = z.infer<typeof gradeSchema>;
export type Axes = z.infer<typeof axesSchema>;
export type SectionStatus = z.infer<typeof sectionStatusSchema>;
export type SectionDims = z.infer<typeof sectionDimsSchema>;
export type SpliceDetail = z.infer<typeof spliceDetailSchema>;
export type BasePlate = z.infer<typeof basePlateSchema>;
export type BoltDiameter = z.infer<typeof boltDiameterSchema>;
export type BoltClass = z.infer<typeof boltClassSchema>;
export type ConcreteClass = z.infer<typeof concreteClassSchema>;
export type SupportData = z.infer<typeof supportDataSchema>;
export type LiftData = z.infer<typeof liftDataSchema>;
export type SpliceData = z.infer<typeof spliceDataSchema>;
export type RestraintData = z.infer<typeof restraintDataSchema>;
export type FaceReaction = z.infer<typeof faceReactionSchema>;
export type RestraintFaces = z.infer<typeof restraintFacesSchema>;
export type FaceName = keyof RestraintFaces;
export type CapData = z.infer<typeof capDataSchema>;
export type LoadData = z.infer<typeof loadDataSchema>;
export type StackNode = z.infer<typeof stackNodeSchema>;
export type StackEdge = z.infer<typeof stackEdgeSchema>;
export type StackDocument = z.infer<typeof stackDocumentSchema>;
export type NodeKind = StackNode['kind'];
export type NodeOf<K extends NodeKind> = Extract<StackNode, { kind: K }>;

/** Schema of each kind's data, for validating a partial update (docs/contracts.md §Edits, updateNode). */
export const nodeDataSchemas = {
  support: supportDataSchema,
  lift: liftDataSchema,
  splice: spliceDataSchema,
  restraint: restraintDataSchema,
  cap: capDataSchema,
  load: loadDataSchema,
} as const;
