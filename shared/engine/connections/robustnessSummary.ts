// The building's robustness at a glance: which splices meet the tying requirement of its consequence class.
import type { ConsequenceClass, StackResult } from '../../schema/results.ts';
import { needsVerticalTies } from './tieForce.ts';

export interface TieRow {
  stackId: string | number;
  stackName: string;
  spliceId: string;
  elevation: number;
  /** kN */
  tieForce: number;
  NtRd: number | null;
  meets: boolean;
}

export interface RobustnessSummary {
  consequenceClass: ConsequenceClass | null;
  /** The class asks for vertical ties (EN 1991-1-7 A.6); false when the class is not given. */
  tiesRequired: boolean;
  meeting: TieRow[];
  notMeeting: TieRow[];
  message: string;
}

/** The stacks of a building, as the overview (analyseBuilding) or a frozen revision carries them. */
export interface AnalysedStacks {
  stacks: readonly { id: string | number; name: string; result: StackResult }[];
}

export function robustnessSummary(
  building: AnalysedStacks,
  consequenceClass: ConsequenceClass | undefined,
): RobustnessSummary {
  const cc = consequenceClass ?? null;
  const required = cc !== null && needsVerticalTies(cc);
  const meeting: TieRow[] = [];
  const notMeeting: TieRow[] = [];
  if (required) {
    for (const stack of building.stacks) {
      for (const s of stack.result.splices ?? []) {
        const row = {
          stackId: stack.id,
          stackName: stack.name,
          spliceId: s.nodeId,
          elevation: s.elevation,
          tieForce: s.tieForce ?? 0,
          NtRd: s.NtRd,
          meets: s.meetsTie === true,
        };
        (row.meets ? meeting : notMeeting).push(row);
      }
    }
  }
  const message =
    cc === null
      ? 'Consequence class not given: the tying requirement of EN 1991-1-7 Annex A is not checked'
      : !required
        ? `Consequence class ${cc}: EN 1991-1-7 Annex A asks for no vertical ties`
        : `Consequence class ${cc}: ${meeting.length} splice(s) meet the vertical tie force of EN 1991-1-7 A.6, ${notMeeting.length} do not` +
          (cc === '3' ? '; class 3 also needs a systematic risk assessment (A.4(1))' : '');
  return { consequenceClass: cc, tiesRequired: required, meeting, notMeeting, message };
}
