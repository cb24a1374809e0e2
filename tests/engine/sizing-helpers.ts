// Shared by the sizing tests: stacks (demo data, invented) and the proposal written into a document.
import type { StackSizing } from '../../shared/schema/sizing.ts';
import { sizingRequestSchema, type SizingRequest, type SizingRequestInput } from '../../shared/schema/sizing.ts';
import type { Grade, StackDocument } from '../../shared/schema/stack.ts';
import { buildStack } from './stack-builder.ts';

export function request(input: Partial<SizingRequestInput> = {}): SizingRequest {
  return sizingRequestSchema.parse({ series: 'UKC', grade: 'S355', ...input });
}

/** The document with the given sections (bottom lift first, lift ids l1, l2, …). */
export function withSections(doc: StackDocument, sections: readonly string[], grade: Grade = 'S355'): StackDocument {
  return {
    edges: doc.edges,
    nodes: doc.nodes.map((n) => {
      const i = n.kind === 'lift' ? Number(n.id.slice(1)) - 1 : -1;
      return n.kind === 'lift' && sections[i] ? { ...n, data: { ...n.data, section: sections[i], grade } } : n;
    }),
  };
}

/** The document as it would be after accepting every proposed lift. */
export function accepted(doc: StackDocument, sizing: StackSizing): StackDocument {
  return {
    edges: doc.edges,
    nodes: doc.nodes.map((n) => {
      const row = sizing.lifts.find((l) => l.liftId === n.id);
      return n.kind === 'lift' && row?.after
        ? { ...n, data: { ...n.data, section: row.after.section, grade: row.after.grade } }
        : n;
    }),
  };
}

/**
 * Three lifts (0–3 m, 3–6 m, 6–13 m) where the top lift is long about z-z, so that left alone it
 * wants a heavier section than the lift below: the rules then change the answer.
 */
export function tallTopStack(G = 150): StackDocument {
  return buildStack({
    lifts: [{ top: 3 }, { top: 6 }, { top: 13 }],
    floors: [
      { elevation: 3, Gk: G, Qk: G / 2, category: 'B' },
      { elevation: 6, Gk: G, Qk: G / 2, category: 'B' },
      { elevation: 9.5, Gk: G, Qk: G / 2, category: 'B', axes: 'y' },
    ],
    cap: { Gk: G, Qk: G / 4, category: 'H' },
  });
}

/** Four two-storey lifts of 4 m storeys, office floors and a roof, a minor-axis-only floor at 12 m. */
export function officeStack(): StackDocument {
  const floors = [4, 8, 12, 16, 20, 24, 28].map((elevation) => ({
    elevation,
    Gk: 120,
    Qk: 60,
    category: 'B' as const,
    axes: elevation === 12 ? ('z' as const) : ('both' as const),
  }));
  return buildStack({
    base: { fixity: 'fixed' },
    lifts: [{ top: 8 }, { top: 16 }, { top: 24 }, { top: 32 }],
    floors,
    cap: { Gk: 60, Qk: 20, category: 'H' },
  });
}
