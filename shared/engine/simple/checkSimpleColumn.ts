// The combined check of a column in simple construction: axial force with the nominal moments.
import type { Annex, CalcStep, CombinedCheck, CompressionResult } from '../../schema/results.ts';
import type { Grade } from '../../schema/stack.ts';
import { checkCompression } from '../checkCompression.ts';
import { EngineError } from '../errors.ts';
import { sectionData } from '../sectionData.ts';
import type { SectionDims } from '../sectionTypes.ts';
import { MINOR_AXIS_FACTOR } from './constants.ts';
import { lateralTorsionalReduction } from './lateralTorsionalReduction.ts';

export interface SimpleColumnInput {
  section: SectionDims | string;
  grade: Grade;
  /** Buckling lengths, mm; LcrZ is also the length between lateral restraints. */
  LcrY: number;
  LcrZ: number;
  /** Design axial force checked against buckling about each axis, N. */
  NEdY: number;
  NEdZ: number;
  /** Nominal moments, N·mm. */
  MyEd: number;
  MzEd: number;
  annex?: Annex;
  gammaM0?: number;
  gammaM1?: number;
}

export interface SimpleColumnOptions {
  /** The flexural buckling check already run for this piece with max(NEdY, NEdZ) (saves repeating it). */
  compression?: CompressionResult;
  extraSections?: ReadonlyMap<string, SectionDims>;
}

const METHOD = 'NCCI SN048b simplified interaction';

/** Why a class 4 section is not checked under nominal moments (and so never proposed for one by sizing). */
export const CLASS_4_REFUSAL =
  'The combined check with nominal moments is not available for class 4 sections: the simplified interaction covers class 1 to 3, and a class 4 section under moment needs its effective section moduli and the moment from the shift of its neutral axis (EN 1993-1-1 6.2.2.5(4), eq. 6.61 and 6.62), which are not worked here.';

/**
 * NEd/Nb,min,Rd + My,Ed/Mb,Rd + 1.5·Mz,Ed/Mz,Rd ≤ 1 (NCCI SN048b, from memory), with each axis's own design
 * force in the first term (it is NEd/Nb,min,Rd when the forces agree). Units N, mm. Class 4 is refused.
 */
export function checkSimpleColumn(input: SimpleColumnInput, opts: SimpleColumnOptions = {}): CombinedCheck {
  const annex = input.annex ?? 'UK';
  const gammaM0 = input.gammaM0 ?? 1.0;
  const gammaM1 = input.gammaM1 ?? 1.0;
  if (!(input.MyEd >= 0) || !(input.MzEd >= 0))
    throw new EngineError('invalid_input', 'Nominal moments must be finite numbers ≥ 0.');
  const NEd = Math.max(input.NEdY, input.NEdZ);
  const compression =
    opts.compression ??
    checkCompression(
      { section: input.section, grade: input.grade, LcrY: input.LcrY, LcrZ: input.LcrZ, NEd, annex, gammaM0, gammaM1 },
      { steps: false, extraSections: opts.extraSections },
    );
  if (compression.sectionClass === 4) {
    throw new EngineError('unsupported', CLASS_4_REFUSAL);
  }
  const { dims, props } = sectionData(input.section, opts.extraSections);
  const { fy } = compression;
  const plastic = compression.sectionClass <= 2;
  const Wy = plastic ? props.WplY : props.WelY;
  const Wz = plastic ? props.WplZ : props.WelZ;
  const ltb = lateralTorsionalReduction({
    dims,
    props,
    fy,
    Wy,
    lambdaBarZ: compression.lambdaBarZ,
    Lcr: input.LcrZ,
    annex,
  });
  // EN 1993-1-1 eq. 6.55
  const MbRd = (ltb.chiLT * Wy * fy) / gammaM1;
  // EN 1993-1-1 eq. 6.13 (class 1–2, Wpl) / eq. 6.14 (class 3, Wel)
  const MzRd = (Wz * fy) / gammaM0;
  const axialTerm = Math.max(input.NEdY / compression.NbRdY, input.NEdZ / compression.NbRdZ);
  const majorTerm = input.MyEd / MbRd;
  const minorTerm = (MINOR_AXIS_FACTOR * input.MzEd) / MzRd;
  const utilisation = axialTerm + majorTerm + minorTerm;

  const modulus = plastic ? 'pl' : 'el';
  const steps: CalcStep[] = [
    {
      symbol: 'NEd,y',
      value: input.NEdY,
      unit: 'N',
      clause: 'EN 1990 6.4.3.2',
      description: 'design axial force, y-y buckling segment',
    },
    {
      symbol: 'NEd,z',
      value: input.NEdZ,
      unit: 'N',
      clause: 'EN 1990 6.4.3.2',
      description: 'design axial force, z-z buckling segment',
    },
    { symbol: 'Nb,y,Rd', value: compression.NbRdY, unit: 'N', clause: 'EN 1993-1-1 eq. 6.47' },
    { symbol: 'Nb,z,Rd', value: compression.NbRdZ, unit: 'N', clause: 'EN 1993-1-1 eq. 6.47' },
    {
      symbol: 'My,Ed',
      value: input.MyEd,
      unit: 'N·mm',
      clause: 'simple construction, reactions 100 mm from the face',
      description: 'nominal moment about y-y',
    },
    {
      symbol: 'Mz,Ed',
      value: input.MzEd,
      unit: 'N·mm',
      clause: 'simple construction, reactions 100 mm from the face',
      description: 'nominal moment about z-z',
    },
    { symbol: 'λ̄z', value: compression.lambdaBarZ, unit: '', clause: 'EN 1993-1-1 eq. 6.50' },
    { symbol: 'λ̄LT', value: ltb.lambdaBarLT, unit: '', clause: ltb.slendernessRule },
    { symbol: 'curve LT', value: ltb.curve ?? '-', unit: '', clause: ltb.curveRule },
    {
      symbol: 'λ̄LT,0',
      value: ltb.lambdaLT0,
      unit: '',
      clause: ltb.beta < 1 ? 'EN 1993-1-1 6.3.2.3(1)' : 'EN 1993-1-1 6.3.2.2(4)',
    },
    {
      symbol: 'β',
      value: ltb.beta,
      unit: '',
      clause: ltb.beta < 1 ? 'EN 1993-1-1 6.3.2.3(1)' : 'EN 1993-1-1 eq. 6.56',
    },
    {
      symbol: 'χLT',
      value: ltb.chiLT,
      unit: '',
      clause: ltb.beta < 1 ? 'EN 1993-1-1 eq. 6.57' : 'EN 1993-1-1 eq. 6.56',
    },
    { symbol: `W${modulus},y`, value: Wy, unit: 'mm³', clause: 'EN 1993-1-1 6.3.2.1(3)' },
    { symbol: 'Mb,Rd', value: MbRd, unit: 'N·mm', clause: 'EN 1993-1-1 eq. 6.55' },
    {
      symbol: `W${modulus},z`,
      value: Wz,
      unit: 'mm³',
      clause: plastic ? 'EN 1993-1-1 eq. 6.13' : 'EN 1993-1-1 eq. 6.14',
    },
    { symbol: 'Mz,Rd', value: MzRd, unit: 'N·mm', clause: plastic ? 'EN 1993-1-1 eq. 6.13' : 'EN 1993-1-1 eq. 6.14' },
    { symbol: 'NEd/Nb,min,Rd', value: axialTerm, unit: '', clause: METHOD },
    { symbol: 'My,Ed/Mb,Rd', value: majorTerm, unit: '', clause: METHOD },
    { symbol: '1.5·Mz,Ed/Mz,Rd', value: minorTerm, unit: '', clause: METHOD },
    { symbol: 'utilisation', value: utilisation, unit: '', clause: METHOD, description: 'combined check, ≤ 1.0' },
  ];
  return {
    NEdY: input.NEdY,
    NEdZ: input.NEdZ,
    MyEd: input.MyEd,
    MzEd: input.MzEd,
    NbRdY: compression.NbRdY,
    NbRdZ: compression.NbRdZ,
    lambdaBarLT: ltb.lambdaBarLT,
    chiLT: ltb.chiLT,
    MbRd,
    MzRd,
    axialTerm,
    majorTerm,
    minorTerm,
    utilisation,
    steps,
  };
}
