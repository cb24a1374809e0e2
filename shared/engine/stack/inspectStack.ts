// Reads a stack document into the model the analysis works on, collecting every problem on the way.
import type { Issue } from '../../schema/results.ts';
import type { LiftData, StackDocument } from '../../schema/stack.ts';
import { readAttachments, type ModelRestraint } from './attachments.ts';
import type { AnalysisContext } from './context.ts';
import { lostLevelWarnings, placeOnLevels } from './placeOnLevels.ts';
import { isLiftSection, resolveLiftSection, type LiftSection } from './liftSections.ts';
import { schemaIssues } from './schemaIssues.ts';
import { segmentsAbout, type Segment } from './segments.ts';
import { walkStackChain } from './stackChain.ts';
import { buildStackGraph } from './stackGraph.ts';
import type { LoadEntry } from './takeDown.ts';

export interface ModelLift {
  id: string;
  /** L1, L2, … from the bottom. */
  name: string;
  bottom: number;
  top: number;
  data: LiftData;
  section: LiftSection;
}

export interface StackModel {
  lifts: ModelLift[];
  restraints: ModelRestraint[];
  /** Where load enters the column, top to bottom. */
  entries: LoadEntry[];
  segments: { y: Segment[]; z: Segment[] };
}

export const BRACED_FRAME_WARNING: Issue = {
  message:
    'The analysis assumes a braced (non-sway) frame in simple construction: sway effects, frame moments from continuous connections, fire, seismic actions and the connections themselves are not checked; only the nominal moments of beam reactions given on the column faces are included',
};

export interface Inspection {
  model: StackModel | null;
  errors: Issue[];
  warnings: Issue[];
}

export function inspectStack(doc: StackDocument, context: AnalysisContext = {}): Inspection {
  const warnings: Issue[] = [BRACED_FRAME_WARNING];
  const shape = context.shapeChecked ? [] : schemaIssues(doc);
  if (shape.length) return { model: null, errors: shape, warnings };

  warnings.push(...lostLevelWarnings(doc, context.levels));
  const { graph, issues: graphErrors } = buildStackGraph(placeOnLevels(doc, context.levels));
  const { chain, issues: chainErrors } = walkStackChain(graph);
  const attached = readAttachments(graph, chain);
  const errors = [...graphErrors, ...chainErrors, ...attached.errors];
  if (!chain.complete || !chain.support || !chain.cap || errors.length) return { model: null, errors, warnings };

  const { support, cap } = chain;
  const ends = {
    support: { nodeId: support.id, elevation: support.data.elevation, fixity: support.data.fixity },
    cap: { nodeId: cap.id, elevation: cap.data.elevation, fixity: cap.data.fixity },
  };
  const { restraints, entries } = attached.attachments;
  const y = segmentsAbout('y', ends, restraints);
  const z = segmentsAbout('z', ends, restraints);
  errors.push(...y.errors, ...z.errors);
  if (errors.length) return { model: null, errors, warnings };

  const lifts: ModelLift[] = [];
  for (const { node, name, below, above } of chain.lifts) {
    // A placeholder section is never checked as if chosen; a copied one is checked but flagged.
    if (node.data.sectionStatus === 'not-chosen') {
      errors.push({
        nodeId: node.id,
        message: `Lift ${name}: section not chosen; pick its section in the properties pane`,
      });
      continue;
    }
    if (node.data.sectionStatus === 'to-confirm') {
      warnings.push({
        nodeId: node.id,
        message: `Lift ${name}: section copied from the lift it was split from; confirm it or pick another`,
      });
    }
    const section = resolveLiftSection(node.data, name, node.id, context.sections);
    if (!isLiftSection(section)) errors.push(section);
    else
      lifts.push({
        id: node.id,
        name,
        bottom: below.data.elevation,
        top: above ? above.data.elevation : below.data.elevation,
        data: node.data,
        section,
      });
  }
  if (errors.length) return { model: null, errors, warnings };
  return { model: { lifts, restraints, entries, segments: { y: y.segments, z: z.segments } }, errors, warnings };
}
