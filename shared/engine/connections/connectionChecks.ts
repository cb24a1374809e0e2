// The splice and base checks of one stack, from the model and take-down the member checks already use.
import type { AnalysisOptions, BaseCheck, CalcStep, SpliceCheck, TakeDownRow } from '../../schema/results.ts';
import type { NodeOf, StackDocument } from '../../schema/stack.ts';
import { isEngineError } from '../errors.ts';
import { designAxialForce } from '../stack/combination.ts';
import { SAME_ELEVATION_M } from '../stack/context.ts';
import type { ModelLift, StackModel } from '../stack/inspectStack.ts';
import { axialStateAt, type ColumnWeight } from '../stack/takeDown.ts';
import { checkBasePlate } from './checkBasePlate.ts';
import { spliceTensionResistance } from './checkSpliceTension.ts';
import { spliceFit } from './spliceFit.ts';
import { needsVerticalTies, verticalTieForce, type TieForce } from './tieForce.ts';

/** γG,inf for favourable permanent actions: EN 1990 Table A1.2(B). */
export const GAMMA_G_INF = 1.0;

interface Forces {
  /** Design compression (N) and the least compression under permanent load alone (N; negative is tension). */
  NEd: number;
  Nmin: number;
}

function forcesAt(
  model: StackModel,
  weights: readonly ColumnWeight[],
  rows: readonly TakeDownRow[],
  elevation: number,
  includeEntriesAt: boolean,
  options: AnalysisOptions,
): Forces {
  const state = axialStateAt(model.entries, weights, elevation, includeEntriesAt);
  let NEd = designAxialForce(state, options).NEd;
  // The take-down never lets the force fall below the force above (see takeDown.ts)
  for (const row of rows) if (row.elevation > elevation + SAME_ELEVATION_M) NEd = Math.max(NEd, row.NEd);
  return { NEd: NEd * 1e3, Nmin: GAMMA_G_INF * state.sumGk * 1e3 };
}

function forceSteps(
  forces: Forces,
  tie: TieForce | null,
  consequence: AnalysisOptions['consequenceClass'],
): CalcStep[] {
  const steps: CalcStep[] = [
    {
      symbol: 'NEd',
      value: forces.NEd,
      unit: 'N',
      clause: 'EN 1990 6.4.3.2',
      description: 'Design compression in the joint',
    },
    {
      symbol: 'Nmin,Ed',
      value: forces.Nmin,
      unit: 'N',
      clause: 'EN 1990 Table A1.2(B)',
      description: 'γG,inf = 1.0 on permanent load, no imposed load',
    },
    {
      symbol: 'CC',
      value: consequence ?? 'not given',
      unit: '',
      clause: 'EN 1991-1-7 Table A.1',
      description: 'Consequence class of the building',
    },
  ];
  if (tie) {
    steps.push({
      symbol: 'T',
      value: tie.T,
      unit: 'N',
      clause: 'EN 1991-1-7 A.6(2), EN 1990 eq. 6.11b',
      description: 'Largest storey reaction on the column, Gk + ψ1·Qk (accidental combination)',
    });
  }
  return steps;
}

function checkOneSplice(
  node: NodeOf<'splice'>,
  below: ModelLift,
  above: ModelLift,
  forces: Forces,
  tie: TieForce | null,
  options: AnalysisOptions,
): SpliceCheck {
  const fit = spliceFit(above.section, below.section);
  const tension = Math.max(tie?.T ?? 0, -forces.Nmin, 0);
  const notes: string[] = [fit.fit];
  const steps = forceSteps(forces, tie, options.consequenceClass);
  steps.push({
    symbol: 'Ft,Ed',
    value: tension,
    unit: 'N',
    clause: 'EN 1991-1-7 A.6',
    description: 'Tension to carry: the tie force or net tension, the larger',
  });
  if (options.consequenceClass === undefined) notes.push('Consequence class not given: the tie force is not included');
  if (options.consequenceClass === '3')
    notes.push('Consequence class 3 also needs a systematic risk assessment (EN 1991-1-7 A.4(1))');
  const base = {
    nodeId: node.id,
    elevation: node.data.elevation,
    above: above.section.designation,
    below: below.section.designation,
    sameSerialSize: fit.sameSerialSize,
    packThickness: fit.packThickness,
    divisionPlate: fit.divisionPlate,
    fit: fit.fit,
    NEd: forces.NEd / 1e3,
    NminEd: forces.Nmin / 1e3,
    tieForce: tie ? tie.T / 1e3 : null,
    tension: tension / 1e3,
  };
  const detail = node.data.detail;
  if (!detail || fit.sameSerialSize === null) {
    if (detail) notes.push('The cover-plate detail applies to I sections only');
    return { ...base, NtRd: null, utilisation: null, status: 'not-given', meetsTie: tie ? false : null, notes, steps };
  }
  const resistance = spliceTensionResistance(detail, fit.packThickness, options.annex);
  steps.push(...resistance.steps);
  const utilisation = resistance.NtRd > 0 ? tension / resistance.NtRd : Infinity;
  steps.push({ symbol: 'Ft,Ed/Nt,Rd', value: utilisation, unit: '', clause: 'EN 1993-1-8 2.5' });
  notes.push(
    'Bolt bearing (EN 1993-1-8 Table 3.4 Fb,Rd), block tearing and the column flanges in tension are not checked here',
  );
  if (fit.divisionPlate) notes.push('Division plate: its welds or bolts to the columns must also carry the tension');
  const passes = utilisation <= 1;
  return {
    ...base,
    NtRd: resistance.NtRd / 1e3,
    utilisation,
    status: passes ? 'passes' : 'fails',
    meetsTie: tie ? passes : null,
    notes,
    steps,
  };
}

function checkBase(node: NodeOf<'support'>, lift: ModelLift, forces: Forces, options: AnalysisOptions): BaseCheck {
  const tension = forces.Nmin < 0;
  const notes: string[] = [];
  if (tension)
    notes.push('The base is in tension under minimum permanent load: holding-down bolts must be designed for it');
  const base = { nodeId: node.id, elevation: lift.bottom, NEd: forces.NEd / 1e3, NminEd: forces.Nmin / 1e3, tension };
  const empty = { fjd: null, c: null, tRequired: null, NjRd: null, utilisation: null, status: 'not-given' as const };
  const plate = node.data.basePlate;
  if (!plate || !options.concreteClass) {
    if (!plate) notes.push('Base plate not given');
    if (!options.concreteClass) notes.push('Concrete class of the building not given');
    return { ...base, ...empty, notes, steps: forceSteps(forces, null, options.consequenceClass).slice(0, 2) };
  }
  try {
    const check = checkBasePlate(forces.NEd, lift.section.dims, plate, options.concreteClass, options.annex);
    notes.push(...check.notes);
    const fails =
      check.utilisation > 1 ||
      check.tRequired === null ||
      check.notes.some((n) => n.startsWith('The grout is thicker'));
    return {
      ...base,
      fjd: check.fjd,
      c: check.c,
      tRequired: check.tRequired,
      NjRd: check.NjRd / 1e3,
      utilisation: check.utilisation,
      status: fails ? 'fails' : 'passes',
      notes,
      steps: [forceSteps(forces, null, options.consequenceClass)[1], ...check.steps],
    };
  } catch (error) {
    if (!isEngineError(error)) throw error;
    notes.push(error.message);
    return { ...base, ...empty, notes, steps: [] };
  }
}

export interface ConnectionResults {
  splices: SpliceCheck[];
  base?: BaseCheck;
}

/** Splices bottom to top and the base; a splice whose node cannot be matched to a lift boundary is skipped. */
export function connectionChecks(
  doc: StackDocument,
  model: StackModel,
  weights: readonly ColumnWeight[],
  rows: readonly TakeDownRow[],
  options: AnalysisOptions,
): ConnectionResults {
  const tie =
    options.consequenceClass && needsVerticalTies(options.consequenceClass) ? verticalTieForce(model.entries) : null;
  const spliceNodes = doc.nodes.filter((n): n is NodeOf<'splice'> => n.kind === 'splice');
  const splices: SpliceCheck[] = [];
  for (let i = 0; i + 1 < model.lifts.length; i++) {
    const below = model.lifts[i];
    const above = model.lifts[i + 1];
    const node = spliceNodes.find((n) => Math.abs(n.data.elevation - below.top) <= SAME_ELEVATION_M);
    if (!node) continue;
    splices.push(
      checkOneSplice(node, below, above, forcesAt(model, weights, rows, below.top, false, options), tie, options),
    );
  }
  const support = doc.nodes.find((n): n is NodeOf<'support'> => n.kind === 'support');
  const first = model.lifts[0];
  const base =
    support && first
      ? checkBase(support, first, forcesAt(model, weights, rows, first.bottom, true, options), options)
      : undefined;
  return { splices, base };
}
