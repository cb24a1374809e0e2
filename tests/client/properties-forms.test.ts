// The properties forms: values are checked against the document schema when a field is left; an
// invalid value is refused with a message and never sent as an edit.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { mount, flushPromises } from '@vue/test-utils';
import type { StackDocument } from '@shared/schema/stack.ts';
import NodeForm from '@/components/stack/NodeForm.vue';
import LiftForm from '@/components/stack/LiftForm.vue';
import PropertiesPanel from '@/components/stack/PropertiesPanel.vue';
import SectionPicker from '@/components/stack/SectionPicker.vue';
import { mockFetch } from './fetchMock.ts';

const restraint = { elevation: 4, axes: 'both', fixity: 'pinned', Gk: 100, Qk: 40, category: 'B' };

async function typeInto(w: ReturnType<typeof mount>, field: string, text: string) {
  // Quasar puts data-* attributes on the native input; a value is committed when the field changes.
  const input = w.find(`input[data-field="${field}"]`);
  await input.setValue(text);
  await input.trigger('change');
  await flushPromises();
}

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

describe('node properties form', () => {
  it('labels every quantity with its unit', () => {
    const w = mount(NodeForm, { props: { kind: 'restraint', value: restraint } });
    const labels = w.findAll('.q-field__label').map((l) => l.text());
    expect(labels).toContain('Elevation (m)');
    expect(labels).toContain('Permanent load Gk (kN)');
    expect(labels).toContain('Imposed load Qk (kN)');
  });

  it('shows an elevation to the millimetre, as the node title does', () => {
    const w = mount(NodeForm, { props: { kind: 'splice', value: { elevation: 8 } } });
    expect((w.find('input[data-field="elevation"]').element as HTMLInputElement).value).toBe('8.000');
  });

  it('refuses a negative load with a message and sends nothing', async () => {
    const w = mount(NodeForm, { props: { kind: 'restraint', value: restraint } });
    await typeInto(w, 'Gk', '-5');
    expect(w.text()).toContain('Permanent load Gk must be at least 0 kN');
    expect(w.emitted('change')).toBeUndefined();
  });

  it('refuses text that is not a number', async () => {
    const w = mount(NodeForm, { props: { kind: 'splice', value: { elevation: 8 } } });
    await typeInto(w, 'elevation', 'eight');
    expect(w.text()).toContain('Elevation must be a number');
    expect(w.emitted('change')).toBeUndefined();
  });

  it('sends a valid value as a change of that key only, reading a decimal comma', async () => {
    const w = mount(NodeForm, { props: { kind: 'restraint', value: restraint } });
    await typeInto(w, 'Qk', '42,5');
    expect(w.emitted('change')).toEqual([[{ Qk: 42.5 }]]);
    expect(w.find('.q-field--error').exists()).toBe(false);
  });

  it('sends nothing when the value did not change', async () => {
    const w = mount(NodeForm, { props: { kind: 'restraint', value: restraint } });
    await typeInto(w, 'elevation', '4.000');
    expect(w.emitted('change')).toBeUndefined();
  });

  it('sends a choice at once, as a change of that key only', async () => {
    const w = mount(NodeForm, { props: { kind: 'restraint', value: restraint } });
    const fixity = w.findAllComponents({ name: 'QSelect' }).find((s) => s.text().includes('Rotational fixity'))!;
    expect(fixity.text()).toContain('pinned');
    fixity.vm.$emit('update:modelValue', 'fixed');
    await flushPromises();
    expect(w.emitted('change')).toEqual([[{ fixity: 'fixed' }]]);
  });
});

describe('lift form', () => {
  const lift = { section: 'UKC 203x203x46', grade: 'S355' as const };

  it('refuses a buckling-length factor set by hand without a reason', async () => {
    const w = mount(LiftForm, { props: { value: lift, readOnly: false } });
    await w.find('input[data-field="kY"]').setValue('0.7');
    await w.find('form').trigger('submit');
    await flushPromises();
    expect(w.text()).toContain('Give the reason for setting a factor by hand');
    expect(w.emitted('change')).toBeUndefined();
  });

  it('refuses a factor of zero or less', async () => {
    const w = mount(LiftForm, { props: { value: lift, readOnly: false } });
    await w.find('input[data-field="kZ"]').setValue('0');
    await w.find('textarea[data-field="note"]').setValue('fixed by bracing detail');
    await w.find('form').trigger('submit');
    await flushPromises();
    expect(w.find('.q-field--error').text()).toMatch(/kz, about z-z must/);
    expect(w.emitted('change')).toBeUndefined();
  });

  it('sends a factor with its reason', async () => {
    const w = mount(LiftForm, { props: { value: lift, readOnly: false } });
    await w.find('input[data-field="kY"]').setValue('0.85');
    await w.find('textarea[data-field="note"]').setValue('Base fixed into the pile cap');
    await w.find('form').trigger('submit');
    await flushPromises();
    expect(w.emitted('change')).toEqual([[{ kY: 0.85, note: 'Base fixed into the pile cap' }]]);
  });

  it('removes the overrides by replacing the lift data without them', async () => {
    const w = mount(LiftForm, { props: { value: { ...lift, kY: 0.85, note: 'why' }, readOnly: false } });
    await w.find('[data-action="remove-overrides"]').trigger('click');
    expect(w.emitted('replace')).toEqual([[lift]]);
  });

  it('lets a viewer read the values without buttons to change them', () => {
    const w = mount(LiftForm, { props: { value: lift, readOnly: true } });
    expect(w.find('[data-action="apply-overrides"]').exists()).toBe(false);
  });

  it('shows a viewer no empty override fields, series search or advice on filling them in', () => {
    const w = mount(LiftForm, { props: { value: lift, readOnly: true } });
    expect(w.find('input[data-field="kY"]').exists()).toBe(false);
    expect(w.find('textarea[data-field="note"]').exists()).toBe(false);
    expect(w.find('[data-field="series"]').exists()).toBe(false);
    expect(w.find('[data-test="k-caption"]').text()).toContain(
      'worked out from the restraints and fixities (none set by hand)',
    );
    expect(w.find('[data-test="k-caption"]').text()).not.toContain('Leave blank');
  });

  it('shows a viewer the factors and the reason that were set by hand', () => {
    const w = mount(LiftForm, {
      props: { value: { ...lift, kZ: 0.85, note: 'Base fixed into the pile cap' }, readOnly: true },
    });
    expect((w.find('input[data-field="kZ"]').element as HTMLInputElement).value).toBe('0.85');
    expect((w.find('textarea[data-field="note"]').element as HTMLTextAreaElement).value).toBe(
      'Base fixed into the pile cap',
    );
  });

  it('names the grade without tying it to one product standard (hollow sections take fy from another)', () => {
    const w = mount(LiftForm, { props: { value: lift, readOnly: false } });
    expect(w.findAll('.q-field__label').map((l) => l.text())).toContain('Steel grade');
  });
});

describe('section picker', () => {
  it('searches the catalogue on the server with the typed text and the series', async () => {
    const requests = mockFetch({
      'GET /api/sections?q=203&series=UKC': () => ({
        status: 200,
        body: [{ designation: 'UKC 203x203x46', series: 'UKC', massPerMetre: 46.1 }],
      }),
      'GET /api/sections?q=203': () => ({
        status: 200,
        body: [{ designation: 'UKC 203x203x46', series: 'UKC', massPerMetre: 46.1 }],
      }),
    });
    const w = mount(SectionPicker, {
      props: { modelValue: 'UKC 203x203x46', readOnly: false },
      attachTo: document.body,
    });
    const select = w.findAllComponents({ name: 'QSelect' })[1];
    (select.vm as unknown as { filter: (t: string, keepClosed: boolean) => void }).filter('203', true);
    await flushPromises();
    expect(requests.map((r) => r.url)).toContain('/api/sections?q=203');
    w.unmount();
  });
});

describe('properties panel', () => {
  const doc: StackDocument = {
    nodes: [{ id: 'r1', kind: 'restraint', data: restraint as never }],
    edges: [],
  };

  it('turns a valid change into an updateNode edit named after the node', async () => {
    const w = mount(PropertiesPanel, { props: { doc, selection: ['r1'], results: null, readOnly: false } });
    await typeInto(w, 'Gk', '130');
    const [ops, label] = w.emitted('edit')?.[0] as [unknown[], string];
    expect(ops).toEqual([{ op: 'updateNode', id: 'r1', data: { Gk: 130 } }]);
    expect(label).toBe('Change Gk of Restraint +4.000');
  });

  it('shows the problems the analysis found on the selected node', () => {
    const results = {
      errors: [{ nodeId: 'r1', message: 'Restraint R1 is not attached to a lift' }],
      warnings: [],
      lifts: [],
      governingLiftId: null,
      takeDown: [],
    };
    const w = mount(PropertiesPanel, { props: { doc, selection: ['r1'], results, readOnly: false } });
    expect(w.text()).toContain('Restraint R1 is not attached to a lift');
  });
});
