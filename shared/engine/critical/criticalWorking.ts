// What the results say about lengths from the critical buckling analysis: the working of each checked
// piece names the analysis and its αcr, and a lift whose analysed length is longer than the table's
// gets a warning (the analysis is never silently less safe than the table: the lead chose it).
import type { CalcStep, Issue, LiftResult, StackResult } from '../../schema/results.ts';
import type { Axis } from '../stack/segments.ts';
import { PARTIAL_SPRING_FACTOR } from './stackColumn.ts';

const AXIS_NAME = { y: 'y-y', z: 'z-z' } as const;

function annotate(steps: CalcStep[], axis: Axis, alphaCr: number): void {
  const at = steps.findIndex((s) => s.symbol === `Lcr,${axis}`);
  if (at < 0) return;
  steps[at] = {
    ...steps[at],
    clause: 'EN 1993-1-1 6.3.1.2(1)',
    description: `equivalent buckling length π√(EI/Ncr) with Ncr = αcr,${axis}·NEd,${axis} from the critical buckling analysis of the stack`,
  };
  steps.splice(at, 0, {
    symbol: `αcr,${axis}`,
    value: alphaCr,
    unit: '',
    clause: 'EN 1993-1-1 5.2.1(3), eq. 5.1',
    description: `lowest load factor of the whole stack about ${AXIS_NAME[axis]} on the design forces (elastic critical buckling analysis)`,
  });
}

/** Writes the analysis into the working of every piece that carries one (the checked piece of each lift). */
export function annotateCriticalSteps(lifts: readonly LiftResult[], alphaCr: { y: number; z: number }): void {
  for (const lift of lifts) {
    for (const piece of lift.pieces) {
      if (!piece.check.steps.length) continue;
      if (piece.tableKY !== undefined) annotate(piece.check.steps, 'y', alphaCr.y);
      if (piece.tableKZ !== undefined) annotate(piece.check.steps, 'z', alphaCr.z);
    }
  }
}

/** One warning per lift and axis where the analysis gives a longer buckling length than the table. */
export function longerThanTableWarnings(lifts: readonly LiftResult[]): Issue[] {
  const warnings: Issue[] = [];
  for (const lift of lifts) {
    for (const axis of ['y', 'z'] as const) {
      let worst: { k: number; table: number } | null = null;
      for (const p of lift.pieces) {
        const k = axis === 'y' ? p.kY : p.kZ;
        const table = axis === 'y' ? p.tableKY : p.tableKZ;
        if (table !== undefined && k > table * (1 + 1e-9) && (!worst || k / table > worst.k / worst.table))
          worst = { k, table };
      }
      if (!worst) continue;
      warnings.push({
        nodeId: lift.liftId,
        message: `Lift ${lift.label ?? lift.liftId}: the critical buckling analysis gives a longer buckling length about ${AXIS_NAME[axis]} than the tabulated factor (k = ${worst.k.toFixed(2)} against ${worst.table.toFixed(2)}): the tabulated factor would be less safe here, and the checks use the analysis`,
      });
    }
  }
  return warnings;
}

/** The note every result from the analysis carries: what was analysed, and how. */
export function criticalBasisNote(result: NonNullable<StackResult['criticalBuckling']>): Issue {
  return {
    message: `Buckling lengths come from an elastic critical buckling analysis of the whole stack (αcr,y = ${result.y.alphaCr.toFixed(2)}, αcr,z = ${result.z.alphaCr.toFixed(2)} on the design forces): the column alone, held laterally at its restraints, partial fixity taken as a rotational spring of ${PARTIAL_SPRING_FACTOR === 1 ? '' : `${PARTIAL_SPRING_FACTOR}·`}EI/L of the adjacent segment`,
  };
}
