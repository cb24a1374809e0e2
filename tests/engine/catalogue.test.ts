import { describe, expect, it } from 'vitest';
import {
  CATALOGUE,
  findSection,
  listSeries,
  resolveSection,
  searchSections,
  sectionsInSeries,
} from '../../shared/catalogue/index.ts';
import { EngineError } from '../../shared/engine/errors.ts';
import { sectionProperties } from '../../shared/engine/sectionProperties.ts';
import type { SectionDims } from '../../shared/schema/stack.ts';

describe('catalogue self-consistency', () => {
  // The kg/m in a UKC/UKB designation (BS 4-1) and the nominal mass of HE/IPE (EN 10365) are
  // independent of the typed dimensions: a mistyped h, b, tw, tf or r moves the computed mass.
  const withMass = CATALOGUE.filter((e) => e.massPerMetre !== undefined);

  it('every UKC, UKB, HE and IPE row carries its nominal mass', () => {
    const rolled = CATALOGUE.filter((e) => ['UKC', 'UKB', 'HE A', 'HE B', 'HE M', 'IPE'].includes(e.series));
    expect(withMass.length).toBe(rolled.length);
  });

  for (const entry of withMass) {
    it(`${entry.designation}: mass from the dimensions is within 2% of ${entry.massPerMetre} kg/m`, () => {
      const computed = sectionProperties(entry.dims).massPerMetre;
      expect(Math.abs(computed / entry.massPerMetre! - 1)).toBeLessThanOrEqual(0.02);
    });
  }

  it('the mass in a UKC/UKB designation is the one stored with the row', () => {
    for (const e of CATALOGUE.filter((x) => x.series === 'UKC' || x.series === 'UKB')) {
      expect(Number(e.designation.split('x').pop())).toBe(e.massPerMetre);
    }
  });

  it('every row gives valid section properties and no designation appears twice', () => {
    for (const e of CATALOGUE) expect(sectionProperties(e.dims).A).toBeGreaterThan(0);
    expect(new Set(CATALOGUE.map((e) => e.designation)).size).toBe(CATALOGUE.length);
  });
});

describe('catalogue coverage', () => {
  it('holds the full UKC range, at least 30 UKB, HE A/B 100–600, HE M 100–400, IPE 100–600 and 60+ hollow sections', () => {
    expect(sectionsInSeries('UKC').length).toBeGreaterThanOrEqual(43);
    expect(sectionsInSeries('UKB').length).toBeGreaterThanOrEqual(30);
    for (const s of ['HE A', 'HE B'] as const) {
      expect(sectionsInSeries(s).map((e) => e.designation)).toEqual(
        expect.arrayContaining([`HE 100 ${s.at(-1)}`, `HE 600 ${s.at(-1)}`]),
      );
      expect(sectionsInSeries(s)).toHaveLength(19);
    }
    expect(sectionsInSeries('HE M').map((e) => e.designation)).toEqual(
      expect.arrayContaining(['HE 100 M', 'HE 400 M']),
    );
    expect(sectionsInSeries('IPE').map((e) => e.designation)).toEqual(expect.arrayContaining(['IPE 100', 'IPE 600']));
    const hollow = ['SHS', 'RHS', 'CHS'].flatMap((s) => sectionsInSeries(s));
    expect(hollow.length).toBeGreaterThanOrEqual(60);
  });

  it('lists the series in picker order and gives nothing for an unknown series', () => {
    expect(listSeries()).toEqual(['UKC', 'UKB', 'HE A', 'HE B', 'HE M', 'IPE', 'SHS', 'RHS', 'CHS']);
    expect(sectionsInSeries('W')).toEqual([]);
  });
});

describe('findSection', () => {
  it('finds the designations written as in the product tables', () => {
    for (const d of [
      'UKC 203x203x46',
      'HE 300 B',
      'SHS 200x200x10',
      'CHS 219.1x8.0',
      'IPE 300',
      'RHS 300x200x10',
      'UKB 457x191x67',
    ]) {
      expect(findSection(d)?.designation).toBe(d);
    }
  });

  it('ignores case, spacing, × and trailing zeros, and knows the usual spellings', () => {
    expect(findSection('ukc 203 × 203 × 46')?.designation).toBe('UKC 203x203x46');
    expect(findSection('UC203x203x46')?.designation).toBe('UKC 203x203x46');
    expect(findSection('HEB300')?.designation).toBe('HE 300 B');
    expect(findSection('HE 300B')?.designation).toBe('HE 300 B');
    expect(findSection('chs 219.1x8')?.designation).toBe('CHS 219.1x8.0');
    expect(findSection('SHS 200x200x10.0')?.designation).toBe('SHS 200x200x10');
    expect(findSection('  ipe300 ')?.designation).toBe('IPE 300');
  });

  it('returns undefined for a size that does not exist', () => {
    expect(findSection('UKC 203x203x47')).toBeUndefined();
    expect(findSection('')).toBeUndefined();
  });
});

describe('searchSections', () => {
  it('finds by designation prefix, in catalogue order, up to the limit', () => {
    const hits = searchSections('UKC 203', 50).map((e) => e.designation);
    expect(hits[0]).toBe('UKC 203x203x127');
    expect(hits.every((d) => d.startsWith('UKC 203x203x'))).toBe(true);
    expect(hits).toHaveLength(8);
    expect(searchSections('UKC', 5)).toHaveLength(5);
  });

  it('finds by size without the series name', () => {
    const hits = searchSections('203x133').map((e) => e.designation);
    expect(hits).toEqual(['UKB 203x133x30', 'UKB 203x133x25']);
    expect(searchSections('heb 30').map((e) => e.designation)).toEqual(['HE 300 B']);
    expect(searchSections('HE 1').map((e) => e.designation)).toContain('HE 100 A');
    expect(searchSections('HEM', 100)).toHaveLength(15);
  });

  it('returns nothing for a limit of zero or an unknown prefix', () => {
    expect(searchSections('UKC', 0)).toEqual([]);
    expect(searchSections('ZZZ')).toEqual([]);
  });
});

describe('resolveSection', () => {
  it('resolves a catalogue designation to its canonical name and dimensions', () => {
    expect(resolveSection('heb 300')).toEqual({ designation: 'HE 300 B', dims: findSection('HE 300 B')!.dims });
  });

  it('names a section given by dimensions after its plates', () => {
    const dims: SectionDims = { shape: 'I', make: 'welded', h: 300, b: 200, tw: 8, tf: 12, r: 0 };
    expect(resolveSection(dims).designation).toBe('I 300x200x8x12 (welded)');
    expect(resolveSection({ shape: 'RHS', make: 'cold-formed', h: 150, b: 100, t: 6 }).designation).toBe(
      'RHS 150x100x6 (cold-formed)',
    );
  });

  it("prefers the building's own sections and matches their names loosely", () => {
    const own = new Map<string, SectionDims>([
      ['Col-A', { shape: 'I', make: 'welded', h: 400, b: 300, tw: 10, tf: 20, r: 0 }],
    ]);
    expect(resolveSection('Col-A', own).dims).toEqual(own.get('Col-A'));
    expect(resolveSection('col-a', own).dims).toEqual(own.get('Col-A'));
  });

  it('throws unknown_section with the name and similar sizes for a designation it does not know', () => {
    const attempt = () => resolveSection('UKC 203x203x47');
    expect(attempt).toThrow(EngineError);
    expect(attempt).toThrow(expect.objectContaining({ code: 'unknown_section' }));
    expect(attempt).toThrow(/UKC 203x203x47.*Similar: UKC 203x203x127/);
  });

  it('throws invalid_input for dimensions that cannot exist', () => {
    expect(() => resolveSection({ shape: 'CHS', make: 'hot-finished', d: 100, t: -1 })).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
  });
});
