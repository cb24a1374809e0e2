// The results pane: one row per lift with the governing lift highlighted, the working of a selected
// lift with its clause references, the buckling-curve plot and the elevation drawing.
import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import type { StackResult } from '@shared/schema/results.ts';
import type { StackDocument } from '@shared/schema/stack.ts';
import { analyseStack } from '@shared/engine/index.ts';
import { BRACED_FRAME_WARNING } from '@shared/engine/stack/inspectStack.ts';
import ResultsPanel from '@/components/stack/ResultsPanel.vue';
import BucklingCurvePlot from '@/components/stack/BucklingCurvePlot.vue';
import { bucklingCurvePoints } from '@/components/stack/bucklingCurvePoints.ts';
import { liftRows } from '@/components/stack/liftRows.ts';

// Invented four-storey stack: base to +8 in a heavier section, splice, +8 to +14 lighter, roof cap.
const floor = (id: string, elevation: number) => ({
  id,
  kind: 'restraint' as const,
  data: { elevation, axes: 'both' as const, fixity: 'pinned' as const, Gk: 260, Qk: 110, category: 'B' as const },
});
const doc: StackDocument = {
  nodes: [
    { id: 'sup', kind: 'support', data: { elevation: 0, fixity: 'pinned' } },
    { id: 'l1', kind: 'lift', data: { section: 'UKC 203x203x60', grade: 'S355' } },
    { id: 'sp', kind: 'splice', data: { elevation: 8 } },
    { id: 'l2', kind: 'lift', data: { section: 'UKC 152x152x30', grade: 'S355' } },
    { id: 'cap', kind: 'cap', data: { elevation: 14, fixity: 'pinned', Gk: 150, Qk: 40, category: 'H' } },
    floor('r4', 4),
    floor('r8', 8),
    floor('r11', 11),
  ],
  edges: [
    { id: 'e1', source: 'sup', target: 'l1' },
    { id: 'e2', source: 'l1', target: 'sp' },
    { id: 'e3', source: 'sp', target: 'l2' },
    { id: 'e4', source: 'l2', target: 'cap' },
    { id: 'e5', source: 'r4', target: 'l1' },
    { id: 'e6', source: 'r8', target: 'l1' },
    { id: 'e7', source: 'r11', target: 'l2' },
  ],
};
const results: StackResult = analyseStack(doc);

const mountPanel = (selectedLiftId: string | null = null, r: StackResult | null = results) =>
  mount(ResultsPanel, { props: { results: r, doc, selectedLiftId, stale: false } });

describe('results table', () => {
  it('has one row per lift with the columns the check needs, units in the headings', () => {
    expect(results.errors).toEqual([]);
    const w = mountPanel();
    const heads = w.findAll('thead th').map((t) => t.text());
    for (const h of [
      'Section',
      'Grade',
      'NEd (kN)',
      'Lcr,y (m)',
      'Lcr,z (m)',
      'λ̄y',
      'λ̄z',
      'χy',
      'χz',
      'Nb,Rd (kN)',
      'Utilisation',
      'Governed by',
    ])
      expect(heads).toContain(h);
    expect(w.findAll('tbody tr[data-row-key]')).toHaveLength(2);
  });

  it('highlights the governing lift and names it above the table', () => {
    const w = mountPanel();
    const governing = w.find('tr.results-table__governing');
    expect(governing.attributes('data-row-key')).toBe(results.governingLiftId);
    expect(w.findAll('tr.results-table__governing')).toHaveLength(1);
    expect(w.find('[data-governing-summary]').text()).toContain(
      results.lifts.find((l) => l.liftId === results.governingLiftId)?.section,
    );
  });

  it('shows Nb,Rd in kN and a χ that agrees with its λ̄ by EN 1993-1-1 eq. 6.49', () => {
    const [row] = liftRows(results, doc);
    const piece = results.lifts[0].pieces.reduce((a, b) => (b.utilisation > a.utilisation ? b : a));
    expect(row.NbRd).toBeCloseTo(piece.check.NbRd / 1000, 6);
    // Rolled UKC h/b ≤ 1.2, tf ≤ 100 mm, S355: curve c about z-z (EN 1993-1-1 Table 6.2), α = 0.49 (Table 6.1)
    const alpha = 0.49;
    const phi = 0.5 * (1 + alpha * (row.lambdaBarZ - 0.2) + row.lambdaBarZ ** 2);
    expect(row.chiZ).toBeCloseTo(Math.min(1, 1 / (phi + Math.sqrt(phi ** 2 - row.lambdaBarZ ** 2))), 4);
    const w = mountPanel();
    const cells = w
      .find(`tr[data-row-key="${row.liftId}"]`)
      .findAll('td')
      .map((c) => c.text());
    expect(cells).toContain(row.NbRd.toFixed(0));
  });

  it('colours each lift in the elevation by its utilisation band', () => {
    const w = mountPanel();
    for (const l of results.lifts) {
      const band = w.find(`.stack-elevation [data-lift="${l.liftId}"]`).attributes('data-band');
      expect(band).toBe(l.utilisation > 1 ? 'over' : l.utilisation > 0.85 ? 'near' : 'ok');
    }
  });

  it('asks for a lift to be selected, and emits the lift clicked in the table', async () => {
    const w = mountPanel();
    expect(w.text()).toContain('Select a lift');
    await w.find('tr[data-row-key="l2"]').trigger('click');
    expect(w.emitted('select-lift')).toEqual([['l2']]);
  });

  it('lets a lift be chosen from the keyboard: each row takes the focus and answers Enter', async () => {
    const w = mountPanel();
    const row = w.find('tr[data-row-key="l1"]');
    expect(row.attributes('tabindex')).toBe('0');
    await row.trigger('keydown', { key: 'Enter' });
    expect(w.emitted('select-lift')).toEqual([['l1']]);
  });

  it("opens the selected lift's working with clause references and its buckling curve", () => {
    const w = mountPanel('l1');
    expect(w.text()).toContain('Working for lift L1');
    const clauses = w.findAll('[data-clause]').map((r) => r.attributes('data-clause'));
    expect(clauses).toContain('EN 1993-1-1 eq. 6.49');
    expect(w.find('svg.curve-plot [data-mark="z-z"]').exists()).toBe(true);
  });

  it('lists the problems instead of results when the stack cannot be checked', () => {
    const broken: StackResult = {
      errors: [{ nodeId: 'l2', message: 'Lift L2 has no node above it' }],
      warnings: [],
      lifts: [],
      governingLiftId: null,
      takeDown: [],
    };
    const w = mountPanel(null, broken);
    expect(w.find('[role="alert"]').text()).toContain('Lift L2 has no node above it');
    expect(w.find('.results-table').exists()).toBe(false);
  });

  it('carries the safety note and says that sway frames are out of scope', () => {
    const w = mountPanel();
    expect(w.text()).toContain('checked by a competent engineer');
    expect(w.find('[data-scope-note]').text()).toContain('Sway frames are out of scope');
  });

  it('says the braced-frame assumption once, in the scope line, and keeps the warnings particular to the stack', () => {
    const particular = { nodeId: 'l1', message: 'Lift L1 takes its buckling-length factor about z-z from a note' };
    expect(results.warnings).toContainEqual(BRACED_FRAME_WARNING);
    const w = mountPanel(null, { ...results, warnings: [...results.warnings, particular] });
    expect(w.find('[data-test="stack-warnings"]').text()).toContain(particular.message);
    expect(w.find('[data-test="stack-warnings"]').text()).not.toContain('assumes a braced');
    expect(w.find('[data-scope-note]').text()).toContain('frame moments from continuous connections');
    expect(mountPanel().find('[data-test="stack-warnings"]').exists()).toBe(false);
  });

  it('puts the governing lift and the table before the scope line, so a short pane opens on figures', () => {
    const html = mountPanel().html();
    const at = (marker: string) => html.indexOf(marker);
    expect(at('data-governing-summary')).toBeGreaterThan(-1);
    expect(at('data-governing-summary')).toBeLessThan(at('results-table'));
    expect(at('results-table')).toBeLessThan(at('data-scope-note'));
  });
});

describe('elevation drawing', () => {
  it('stops the level lines at the bar, so they never strike through the lift names beside it', () => {
    const w = mountPanel();
    const nameX = Math.min(...w.findAll('.stack-elevation__lift text').map((t) => Number(t.attributes('x'))));
    for (const line of w.findAll('.stack-elevation__level line'))
      expect(Number(line.attributes('x2'))).toBeLessThan(nameX);
  });
});

describe('buckling curve plot', () => {
  it('follows EN 1993-1-1 eq. 6.49: curve b gives χ = 0.597 at λ̄ = 1.0', () => {
    // Φ = 0.5[1 + 0.34(0.8) + 1] = 1.136; χ = 1/(1.136 + √(1.136² − 1)) = 0.597 (hand calculation; the
    // tabulated value in EN 1993-1-1 design aids, from memory, is 0.5970)
    const at1 = bucklingCurvePoints('b', 3, 30).find((p) => Math.abs(p.lambdaBar - 1) < 1e-9);
    expect(at1?.chi).toBeCloseTo(0.597, 3);
    expect(bucklingCurvePoints('a', 3, 30)[1].chi).toBe(1); // λ̄ = 0.1 ≤ 0.2: plateau
  });

  it("sets a curve's name clear above the end of its line", () => {
    const w = mount(BucklingCurvePlot, {
      props: { marks: [{ axis: 'z-z', curve: 'b', lambdaBar: 0.8, chi: 0.6622 }] },
    });
    const points = w.find('polyline').attributes('points')!.trim().split(' ');
    const endY = Number(points[points.length - 1].split(',')[1]);
    expect(endY - Number(w.find('.curve-plot__name').attributes('y'))).toBeGreaterThanOrEqual(10);
  });

  it("marks the lift's λ̄ and χ on the curve", () => {
    const w = mount(BucklingCurvePlot, {
      props: { marks: [{ axis: 'z-z', curve: 'c', lambdaBar: 0.8, chi: 0.6622 }] },
    });
    expect(w.find('[data-mark="z-z"]').text()).toContain('λ̄ = 0.800, χ = 0.662');
    expect(w.findAll('polyline')).toHaveLength(1);
  });
});
