// Splices under the sections sizing proposes: sizing keeps its own rule for choosing sections, and a given splice
// detail that no longer carries its tension (or now needs a division plate) is flagged beside the proposal.
import type { AnalysisOptions, Issue } from '../../schema/results.ts';
import type { LiftSizing } from '../../schema/sizing.ts';
import type { StackDocument } from '../../schema/stack.ts';
import type { AnalysisContext } from '../stack/context.ts';
import { analyseStack } from '../stack/analyseStack.ts';
import { formatElevation } from '../stack/formatElevation.ts';

/** The document with each proposed section and grade in place. */
function proposedDocument(doc: StackDocument, lifts: readonly LiftSizing[]): StackDocument {
  const after = new Map(lifts.flatMap((l) => (l.after ? [[l.liftId, l.after] as const] : [])));
  return {
    ...doc,
    nodes: doc.nodes.map((n) => {
      const pick = n.kind === 'lift' ? after.get(n.id) : undefined;
      return pick && n.kind === 'lift'
        ? { ...n, data: { ...n.data, section: pick.section, grade: pick.grade as typeof n.data.grade } }
        : n;
    }),
  };
}

/** One issue per detailed splice that fails, or newly needs a division plate, with the proposed sections. */
export function splicesAfterSizing(
  doc: StackDocument,
  lifts: readonly LiftSizing[],
  options: AnalysisOptions,
  context: AnalysisContext = {},
): Issue[] {
  if (!doc.nodes.some((n) => n.kind === 'splice' && n.data.detail) || !lifts.some((l) => l.status === 'proposed'))
    return [];
  const before = analyseStack(doc, options, context).splices ?? [];
  const after = analyseStack(proposedDocument(doc, lifts), options, context).splices ?? [];
  const issues: Issue[] = [];
  for (const check of after) {
    const was = before.find((b) => b.nodeId === check.nodeId);
    const where = `Splice at ${formatElevation(check.elevation)}`;
    if (check.status === 'fails')
      issues.push({
        nodeId: check.nodeId,
        message: `${where} fails in tension with the proposed sections (${check.above} on ${check.below})`,
      });
    else if (check.divisionPlate && was && !was.divisionPlate)
      issues.push({
        nodeId: check.nodeId,
        message: `${where} needs a division plate with the proposed sections: the serial size changes`,
      });
  }
  return issues;
}
