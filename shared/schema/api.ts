// Request and response bodies of the REST API (docs/contracts.md §REST routes). Both ends use these; nothing is
// redeclared.
import { z } from 'zod';
import {
  stackDocumentSchema,
  gradeSchema,
  fixitySchema,
  sectionDimsSchema,
  restraintFacesSchema,
  elevationSchema,
} from './stack.ts';
import { opsSchema } from './ops.ts';
import { analysisOptionsSchema, type AnalysisOptions, type StackResult } from './results.ts';

export const roleSchema = z.enum(['viewer', 'engineer', 'lead']);
export type Role = z.infer<typeof roleSchema>;
/** Roles in increasing order of rights. */
export const ROLE_RANK: Record<Role, number> = { viewer: 1, engineer: 2, lead: 3 };

export const emailSchema = z
  .string()
  .trim()
  .max(254)
  .email('must be an e-mail address')
  .transform((s) => s.toLowerCase());
/** bcrypt reads only the first 72 bytes of a password; a longer one is refused rather than cut short. */
export const MAX_PASSWORD_BYTES = 72;
const utf8Length = (s: string) => new TextEncoder().encode(s).length;
export const passwordSchema = z
  .string()
  .min(10, 'must be at least 10 characters')
  .max(200)
  .refine((p) => p.trim().length >= 10, 'must hold at least 10 characters besides spaces')
  .refine(
    (p) => utf8Length(p) <= MAX_PASSWORD_BYTES,
    `must be at most ${MAX_PASSWORD_BYTES} bytes (about 72 letters, fewer with accents or symbols)`,
  );
export const idParamSchema = z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER);

export const registerBodySchema = z
  .object({ email: emailSchema, password: passwordSchema, name: z.string().trim().min(1).max(100) })
  .strict();
export type RegisterBody = z.output<typeof registerBodySchema>;
export const loginBodySchema = z.object({ email: emailSchema, password: z.string().min(1).max(200) }).strict();
export type LoginBody = z.output<typeof loginBodySchema>;
export const verifyEmailBodySchema = z.object({ token: z.string().min(1).max(2000) }).strict();
export const changePasswordBodySchema = z
  .object({ currentPassword: z.string().min(1).max(200), newPassword: passwordSchema })
  .strict();
export const passwordStrengthBodySchema = z
  .object({
    password: z.string().max(200),
    email: z.string().max(254).optional(),
    name: z.string().max(100).optional(),
  })
  .strict();
export type PasswordStrengthBody = z.output<typeof passwordStrengthBodySchema>;

/** How guessable a password is: score 0 (very) to 4 (very unlikely), as the estimator rates it. */
export interface PasswordStrength {
  score: number;
  /** The score a new password needs. */
  required: number;
  acceptable: boolean;
  warning: string | null;
  suggestions: string[];
}

/** What registration answers, the same whether or not the address already has an account. */
export interface RegisterResponse {
  status: 'verification-sent';
  email: string;
}

export interface User {
  id: number;
  email: string;
  name: string;
  isAdmin: boolean;
  /** The owner has followed the link mailed to the address (docs/access.md). */
  emailVerified: boolean;
}
export interface AuthResponse {
  token: string;
  user: User;
}

const name = z.string().trim().min(1).max(120);

export const createBuildingBodySchema = z
  .object({
    name,
    reference: z.string().trim().max(60).optional(),
    options: analysisOptionsSchema.partial().optional(),
  })
  .strict();
export type CreateBuildingBody = z.output<typeof createBuildingBodySchema>;
export const updateBuildingBodySchema = z
  .object({
    name: name.optional(),
    reference: z.string().trim().max(60).optional(),
    options: analysisOptionsSchema.partial().optional(),
  })
  .strict();
export type UpdateBuildingBody = z.output<typeof updateBuildingBodySchema>;

export interface BuildingSummary {
  id: number;
  name: string;
  reference: string;
  role: Role;
  stackCount: number;
  /** Highest governing utilisation of any stack, null when none has results. */
  worstUtilisation: number | null;
  updatedAt: string;
}
export interface Building extends BuildingSummary {
  options: AnalysisOptions;
}

export const addMemberBodySchema = z.object({ email: emailSchema, role: roleSchema }).strict();
export type AddMemberBody = z.output<typeof addMemberBodySchema>;
export const updateMemberBodySchema = z.object({ role: roleSchema }).strict();
export type UpdateMemberBody = z.output<typeof updateMemberBodySchema>;
/** A site admin gives a building with no lead a lead again (docs/faults.md). */
export const restoreLeadBodySchema = z.object({ email: emailSchema }).strict();
export interface Member {
  userId: number | null;
  email: string;
  name: string | null;
  role: Role;
  /** true while the invitation waits for a verified account with this address. */
  pending: boolean;
  /** When a pending invitation ends (ISO time). */
  expiresAt?: string;
  /** For an invitation: whether its e-mail went out (the outbox retries; failed is given up). */
  invitationMail?: { status: 'pending' | 'sent' | 'failed'; attempts: number; error: string | null };
}

/** A building level's elevation lies in the range every elevation of a building does (shared/schema/stack.ts). */
const levelElevationSchema = elevationSchema;
export const createLevelBodySchema = z
  .object({ name: z.string().trim().min(1).max(60), elevation: levelElevationSchema })
  .strict();
export type CreateLevelBody = z.output<typeof createLevelBodySchema>;
export const updateLevelBodySchema = createLevelBodySchema.partial().strict();
export type UpdateLevelBody = z.output<typeof updateLevelBodySchema>;
export interface Level {
  id: string;
  name: string;
  elevation: number;
}

/** Asks what moving a level to `elevation` would do, before saving it. */
export const levelMovePreviewBodySchema = z.object({ elevation: levelElevationSchema }).strict();
/** Each stack that moving a level changes: how many of its nodes follow the level, how many splices keep
 *  their offset above it, and the problems the move would cause (none, or it is refused). */
export interface LevelMovePreview {
  elevation: number;
  stacks: { stackId: number; name: string; nodes: number; splices: number; breaks: string[] }[];
}

/** The most storeys a template makes; a building's levels give at most one more elevation than this. */
export const MAX_TEMPLATE_STOREYS = 120;
/** Floors closer than this cannot be told apart on screen or in the package (elevations print to the mm). */
export const MIN_STOREY_M = 0.001;

/**
 * A stack to build: either regular (storeys × storeyHeight from baseElevation) or at given elevations
 * (`elevations`: base, each floor, top; e.g. a building's levels). Regular bodies are the original shape
 * and stay valid as they were.
 */
export const stackTemplateSchema = z
  .object({
    storeys: z.number().int().min(1).max(MAX_TEMPLATE_STOREYS).optional(),
    storeyHeight: z.number().finite().min(1).max(20).optional(),
    /** Regular templates only; 0 when left out. */
    baseElevation: z.number().finite().min(-100).max(100).optional(),
    /** Base, every floor and the top (m), rising; replaces storeys, storeyHeight and baseElevation. */
    elevations: z
      .array(elevationSchema)
      .min(2)
      .max(MAX_TEMPLATE_STOREYS + 1)
      .optional(),
    spliceEvery: z.number().int().min(1).max(10).default(2),
    /** Section per lift, bottom first; the last one repeats for the remaining lifts. */
    sections: z.array(z.string().trim().min(1).max(80)).min(1).max(120),
    grade: gradeSchema.default('S355'),
    baseFixity: fixitySchema.default('pinned'),
    /** Characteristic floor loads per level (kN) for the template's restraints. */
    Gk: z.number().finite().min(0).max(1e5).default(0),
    Qk: z.number().finite().min(0).max(1e5).default(0),
    /** Beam reactions on the column faces at every floor (part of Gk/Qk), for the nominal moments; optional. */
    faces: restraintFacesSchema.optional(),
    /** Roof beam reactions on the cap's faces; optional. */
    roofFaces: restraintFacesSchema.optional(),
  })
  .strict()
  .superRefine((t, ctx) => {
    const issue = (path: string, message: string) => ctx.addIssue({ code: 'custom', path: [path], message });
    if (t.elevations === undefined) {
      if (t.storeys === undefined) issue('storeys', 'is required (or give elevations instead)');
      if (t.storeyHeight === undefined) issue('storeyHeight', 'is required (or give elevations instead)');
      return;
    }
    // Elevations fix every floor, so a storey height or base elevation beside them could only disagree.
    if (t.storeyHeight !== undefined) issue('storeyHeight', 'must be left out when elevations are given');
    if (t.baseElevation !== undefined)
      issue('baseElevation', 'must be left out when elevations are given (the first elevation is the base)');
    if (t.storeys !== undefined && t.storeys !== t.elevations.length - 1) {
      issue('storeys', `must be one less than the number of elevations (${t.elevations.length - 1}), or left out`);
    }
    const { elevations } = t;
    const low = elevations.findIndex((e, i) => i > 0 && e - elevations[i - 1] < MIN_STOREY_M);
    if (low > 0) {
      ctx.addIssue({
        code: 'custom',
        path: ['elevations', low],
        message: `must rise from floor to floor by at least 1 mm (${elevations[low]} m follows ${elevations[low - 1]} m)`,
      });
    }
  });
export type StackTemplate = z.infer<typeof stackTemplateSchema>;

export const createStackBodySchema = z
  .object({
    name: z.string().trim().min(1).max(40),
    doc: stackDocumentSchema.optional(),
    template: stackTemplateSchema.optional(),
  })
  .strict()
  .refine((b) => !(b.doc && b.template), 'give either doc or template, not both');
export type CreateStackBody = z.output<typeof createStackBodySchema>;
export const putStackBodySchema = z.object({ doc: stackDocumentSchema, baseVersion: z.number().int().min(0) }).strict();
export const patchStackBodySchema = z.object({ name: z.string().trim().min(1).max(40) }).strict();
export type PatchStackBody = z.output<typeof patchStackBodySchema>;
export const applyOpsBodySchema = z.object({ ops: opsSchema, baseVersion: z.number().int().min(0) }).strict();

export interface StackSummary {
  id: number;
  buildingId: number;
  name: string;
  version: number;
  liftCount: number;
  governingLiftId: string | null;
  /** L1, L2, … counted from the bottom (the node id for results stored before lifts had labels). */
  governingLiftLabel: string | null;
  governingSection: string | null;
  utilisation: number | null;
  status: 'passes' | 'fails' | 'errors';
  updatedAt: string;
  /** Grid line ids where the stack stands (docs/building-model.md); null off the grid. */
  gridX?: string | null;
  gridY?: string | null;
  webAlong?: 'x' | 'y';
}
export interface StackDetail {
  id: number;
  buildingId: number;
  name: string;
  doc: z.infer<typeof stackDocumentSchema>;
  version: number;
  results: StackResult;
  gridX?: string | null;
  gridY?: string | null;
  webAlong?: 'x' | 'y';
}

export const companySectionSchema = z
  .object({ designation: z.string().trim().min(1).max(80), dims: sectionDimsSchema })
  .strict();
export type CompanySection = z.infer<typeof companySectionSchema>;
