// The working of the nominal moments on one piece: the reactions, the moment at each floor, the
// stiffness of the storeys that share it, and the moment applied to this piece's lift.
import type { CalcStep, CombinedCheck, PieceCheck } from '../../schema/results.ts';
import { formatElevation } from '../stack/formatElevation.ts';
import type { AxisMoment, FloorMoment } from './floorMoments.ts';
import type { PieceMoments } from './pieceMoments.ts';
import type { StoreyStiffness } from './storeyStiffness.ts';

const SHARE_RULE =
  'simple construction: shared by the storeys’ EI/L, equally when within 1.5 (design guides, from memory)';

function ruleWords(m: AxisMoment, cap: boolean): string {
  if (cap) return 'roof: no column above, the whole moment goes into the top storey';
  if (m.share.rule === 'equal') return 'shared equally (EI/L ratio ≤ 1.5)';
  if (m.share.rule === 'stiffness') return 'shared in proportion to EI/L';
  return 'one column length only';
}

function stiffnessStep(symbol: string, s: StoreyStiffness | null): CalcStep[] {
  if (!s) return [];
  const span = `storey ${formatElevation(s.from)} to ${formatElevation(s.to)} m`;
  const series = s.parts.length > 1 ? `; ${s.parts.length} lengths in series, L/I = Σ Lᵢ/Iᵢ` : '';
  // I in mm⁴ → cm⁴, per metre of storey
  return [
    {
      symbol,
      value: s.stiffness / 1e4,
      unit: 'cm⁴/m',
      clause: 'elastic theory, members in series',
      description: `I/L of the ${span}${series}`,
    },
  ];
}

function axisSteps(axis: 'y' | 'z', floor: FloorMoment | null, side: 'above' | 'below', piece: PieceCheck): CalcStep[] {
  if (!floor) return [];
  const m = floor[axis];
  if (m.M === 0) return [];
  const where = `${floor.cap ? 'cap' : 'floor'} at ${floor.elevation.toFixed(3)} m`;
  const storey = side === 'above' ? m.above : m.below;
  const span = storey ? `storey ${formatElevation(storey.from)} to ${formatElevation(storey.to)}` : 'the storey';
  return [
    {
      symbol: `R${axis},net`,
      value: m.reaction.value * 1000,
      unit: 'N',
      clause: m.reaction.expression,
      description: `${where}: worst imposed-load pattern across the ${axis} faces`,
    },
    {
      symbol: `e${axis}`,
      value: m.e,
      unit: 'mm',
      clause: 'simple construction, reaction 100 mm from the face',
      description: axis === 'y' ? 'h/2 + 100' : 'tw/2 + 100 (hollow: b/2 + 100)',
    },
    {
      symbol: `M${axis},floor`,
      value: m.M * 1e6,
      unit: 'N·mm',
      clause: 'simple construction',
      description: `${where}, R·e`,
    },
    ...stiffnessStep(`(I/L)${axis},below`, m.below),
    ...stiffnessStep(`(I/L)${axis},above`, m.above),
    {
      symbol: `M${axis},${side}`,
      value: m.share[side] * 1e6,
      unit: 'N·mm',
      clause: SHARE_RULE,
      description: `${ruleWords(m, floor.cap)}; not carried to the next floor`,
    },
    {
      symbol: `M${axis},lift`,
      value: m.share[side] * 1e6,
      unit: 'N·mm',
      clause: 'simple construction, on the safe side',
      description: `applied to this lift’s piece ${formatElevation(piece.from)} to ${formatElevation(piece.to)}: the end moment of the ${span} m, taken in full over every piece of it`,
    },
  ];
}

export function momentSteps(m: PieceMoments, piece: PieceCheck): CalcStep[] {
  return [
    ...axisSteps('y', m.floorBelow, 'above', piece),
    ...axisSteps('y', m.floorAbove, 'below', piece),
    ...axisSteps('z', m.floorBelow, 'above', piece),
    ...axisSteps('z', m.floorAbove, 'below', piece),
  ];
}

/** The combination that governs, with each one's utilisation: NEd and the reactions come from the same one. */
export function combinationStep(worst: CombinedCheck, all: readonly CombinedCheck[]): CalcStep {
  const each = all.map((c) => `eq. ${c.combination} ${c.utilisation.toFixed(3)}`).join(', ');
  return {
    symbol: 'combination',
    value: `eq. ${worst.combination}`,
    unit: '',
    clause: 'EN 1990 6.4.3.2',
    description: `NEd and the beam reactions from the same combination; worst of ${each}`,
  };
}
