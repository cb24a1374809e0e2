// The working's figures as screens and calculation sheets print them (shared/stepFormat.ts). Units as
// section tables give them (cm², cm³, cm⁴) and design offices write forces and moments (kN, kN·m):
// common practice, no source.
import { describe, expect, it } from 'vitest';
import { formatStep } from '../../shared/stepFormat.ts';
import { checkCompression } from '../../shared/engine/index.ts';

const step = (symbol: string, value: number | string, unit: string) => formatStep({ symbol, value, unit, clause: '' });

describe('formatStep', () => {
  it('prints forces in kN, moments in kN·m, areas in cm², moduli in cm³ and second moments in cm⁴', () => {
    expect(step('Nb,Rd', 1_196_160, 'N')).toEqual({ value: '1196', unit: 'kN' });
    expect(step('My,Ed', 23_450_000, 'N·mm')).toEqual({ value: '23.45', unit: 'kN·m' });
    expect(step('A', 5870, 'mm²')).toEqual({ value: '58.70', unit: 'cm²' });
    expect(step('Wpl,y', 497_400, 'mm³')).toEqual({ value: '497.4', unit: 'cm³' });
    expect(step('Iy', 45_680_000, 'mm⁴')).toEqual({ value: '4568', unit: 'cm⁴' });
  });

  it('prints buckling lengths in m, partial factors to two places, and leaves other units and text alone', () => {
    expect(step('Lcr,z', 3500, 'mm')).toEqual({ value: '3.500', unit: 'm' });
    expect(step('e,y', 203.2, 'mm')).toEqual({ value: '203.2', unit: 'mm' });
    expect(step('γM0', 1, '')).toEqual({ value: '1.00', unit: '' });
    expect(step('fy', 355, 'N/mm²')).toEqual({ value: '355', unit: 'N/mm²' });
    expect(step('χz', 0.74123, '')).toEqual({ value: '0.741', unit: '' });
    expect(step('curve', 'b', '')).toEqual({ value: 'b', unit: '' });
  });

  it('reads every step of a real check without a raw N·mm, mm², mm³ or mm⁴ figure left', () => {
    const r = checkCompression({ section: 'UKC 203x203x46', grade: 'S355', LcrY: 3500, LcrZ: 3500, NEd: 800e3 });
    const units = new Set(r.steps!.map((s) => formatStep(s).unit));
    for (const raw of ['N', 'N·mm', 'mm²', 'mm³', 'mm⁴']) expect(units.has(raw)).toBe(false);
    expect(units.has('kN')).toBe(true);
  });
});
