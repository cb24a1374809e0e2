// Checks every piece of one lift with the member check (docs/analysis-rules.md §Pieces) and keeps the lift's worst
// piece.
import type { AnalysisOptions, GoverningMode, LiftResult, PieceCheck } from '../../schema/results.ts';
import type { SectionDims } from '../../schema/stack.ts';
import { checkCompression, type CompressionInput } from '../checkCompression.ts';
import { pieceLengths, type LiftCritical } from '../critical/pieceLengths.ts';
import type { ModelLift } from './inspectStack.ts';
import type { PieceSpan } from './stackPieces.ts';

/** Per piece, the largest NEd of the lift's pieces in its segment about one axis (docs/analysis-rules.md §Pieces). */
function largestInSegment(
  pieces: readonly PieceSpan[],
  NEd: readonly number[],
  axis: 'segmentY' | 'segmentZ',
): number[] {
  return pieces.map((p) => pieces.reduce((max, q, j) => (q[axis] === p[axis] && NEd[j] > max ? NEd[j] : max), 0));
}

/** The member check's input in its own units: m → mm, kN → N. */
function memberInput(
  lift: ModelLift,
  options: AnalysisOptions,
  LcrY: number,
  LcrZ: number,
  NEd: number,
): CompressionInput {
  return {
    section: lift.data.section,
    grade: lift.data.grade,
    LcrY: LcrY * 1000,
    LcrZ: LcrZ * 1000,
    NEd: NEd * 1000,
    annex: options.annex,
  };
}

function governingTerm(cross: number, y: number, z: number): { utilisation: number; governing: GoverningMode } {
  if (y > cross && y >= z) return { utilisation: y, governing: 'flexural-y' };
  if (z > cross && z > y) return { utilisation: z, governing: 'flexural-z' };
  return { utilisation: cross, governing: 'cross-section' };
}

/** `NEdAtBottom`: the design force at the bottom of each piece, kN. */
export function checkLift(
  lift: ModelLift,
  spans: readonly PieceSpan[],
  NEdAtBottom: readonly number[],
  options: AnalysisOptions,
  sections?: ReadonlyMap<string, SectionDims>,
  critical?: LiftCritical,
): LiftResult {
  const NEdY = largestInSegment(spans, NEdAtBottom, 'segmentY');
  const NEdZ = largestInSegment(spans, NEdAtBottom, 'segmentZ');
  const pieces: PieceCheck[] = spans.map((span, i) => {
    const { segmentY, segmentZ } = span;
    const NEd = NEdAtBottom[i];
    // With the critical buckling analysis, lengths from it (docs/critical-buckling.md)
    const lengths = critical ? pieceLengths(lift, span, NEdY[i], NEdZ[i], critical) : null;
    const kY = lengths ? lengths.kY : (lift.data.kY ?? segmentY.k);
    const kZ = lengths ? lengths.kZ : (lift.data.kZ ?? segmentZ.k);
    // Lcr = k·L over the whole segment, which may cross splices (docs/analysis-rules.md §Buckling-length factors)
    const LcrY = lengths ? lengths.LcrY : kY * (segmentY.top - segmentY.bottom);
    const LcrZ = lengths ? lengths.LcrZ : kZ * (segmentZ.top - segmentZ.bottom);
    const check = checkCompression(memberInput(lift, options, LcrY, LcrZ, Math.max(NEdY[i], NEdZ[i])), {
      steps: false,
      extraSections: sections,
    });
    // docs/analysis-rules.md §Pieces: max(NEd/Nc,Rd, NEd,y/Nb,y,Rd, NEd,z/Nb,z,Rd); the check is in N
    const term = governingTerm(
      (NEd * 1000) / check.NcRd,
      (NEdY[i] * 1000) / check.NbRdY,
      (NEdZ[i] * 1000) / check.NbRdZ,
    );
    const { utilisation, governing } = term;
    const piece: PieceCheck = {
      from: span.from,
      to: span.to,
      NEd,
      NEdY: NEdY[i],
      NEdZ: NEdZ[i],
      LcrY,
      LcrZ,
      kY,
      kZ,
      utilisation,
      governing,
      check,
    };
    if (lengths?.tableKY !== undefined) piece.tableKY = lengths.tableKY;
    if (lengths?.tableKZ !== undefined) piece.tableKZ = lengths.tableKZ;
    return piece;
  });

  const worst = pieces.reduce((a, b) => (b.utilisation > a.utilisation ? b : a));
  // The working is written out for the piece that governs the lift, the one the calculation sheet shows.
  worst.check = checkCompression(memberInput(lift, options, worst.LcrY, worst.LcrZ, Math.max(worst.NEdY, worst.NEdZ)), {
    extraSections: sections,
  });
  return {
    liftId: lift.id,
    label: lift.name,
    bottom: lift.bottom,
    top: lift.top,
    section: lift.section.designation,
    grade: lift.data.grade,
    utilisation: worst.utilisation,
    governing: worst.governing,
    pieces,
  };
}
