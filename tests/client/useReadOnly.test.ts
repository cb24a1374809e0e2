// An editor decides once whether its fields can be changed (a viewer's role, a lift shown to a viewer) and every
// control inside follows; a control given `readonly` itself keeps it. Grid, build-ups and stack values invented.
import { describe, expect, it } from 'vitest';
import { defineComponent, h } from 'vue';
import { mount, type VueWrapper } from '@vue/test-utils';
import { createPinia } from 'pinia';
import type { Buildup, Grid } from '@shared/schema/building.ts';
import type { StackDocument } from '@shared/schema/stack.ts';
import { provideReadOnly } from '@/composables/useReadOnly.ts';
import GridEditor from '@/components/building/GridEditor.vue';
import BuildupsEditor from '@/components/building/BuildupsEditor.vue';
import NumberField from '@/components/building/NumberField.vue';
import FormSelect from '@/components/forms/FormSelect.vue';
import PropertiesPanel from '@/components/stack/PropertiesPanel.vue';

const grid: Grid = {
  x: { lines: [{ id: 'x1', name: 'A', position: 0 }], edgeBefore: 0, edgeAfter: 1.5 },
  y: { lines: [{ id: 'y1', name: '1', position: 0 }], edgeBefore: 0, edgeAfter: 0 },
};
const office: Buildup = {
  id: 'office',
  name: 'Office',
  permanent: [{ label: 'Slab', gk: 4 }],
  imposed: { qk: 2.5, category: 'B' },
};

const readonlyOf = (w: VueWrapper, selector: string) =>
  w.findAll(selector).map((i) => i.attributes('readonly') !== undefined);
/** Quasar marks a select that cannot be opened on its field, not on an input. */
const selectsReadOnly = (w: VueWrapper) => w.findAll('.q-select').map((s) => s.classes('q-field--readonly'));

describe('an editor sets whether its fields can be changed', () => {
  it('the grid editor gives a viewer every name and position read-only, and an editor none', async () => {
    const w = mount(GridEditor, { props: { grid, canEdit: false }, global: { plugins: [createPinia()] } });
    // Per direction: one line's name and position, and the two slab edges.
    expect(readonlyOf(w, 'input[type="number"]')).toEqual(Array(6).fill(true));
    expect(readonlyOf(w, 'input:not([type="number"])')).toEqual([true, true]);
    await w.setProps({ canEdit: true });
    expect(readonlyOf(w, 'input')).toEqual(Array(8).fill(false));
  });

  it('the build-ups editor gives its numbers, names and choices the same setting', async () => {
    const w = mount(BuildupsEditor, {
      props: { buildups: [office], canEdit: false },
      global: { plugins: [createPinia()] },
    });
    // gk of the slab, qk and the partitions' load; the build-up's and the item's names.
    expect(readonlyOf(w, 'input[type="number"]')).toEqual([true, true, true]);
    expect(readonlyOf(w, '[data-test="buildup-name-0"] input, input[data-test="buildup-name-0"]')).toEqual([true]);
    expect(selectsReadOnly(w)).toEqual([true, true]);
    await w.setProps({ canEdit: true });
    expect(readonlyOf(w, 'input[type="number"]')).toEqual([false, false, false]);
    expect(selectsReadOnly(w)).toEqual([false, false]);
  });

  it('the properties panel reaches the fields of the node form inside it', () => {
    const doc: StackDocument = {
      nodes: [{ id: 's', kind: 'splice', data: { elevation: 8 } }],
      edges: [],
    };
    const props = { doc, selection: ['s'], results: null };
    const viewer = mount(PropertiesPanel, { props: { ...props, readOnly: true } });
    expect(viewer.get('input[data-field="elevation"]').attributes('readonly')).toBeDefined();
    const editor = mount(PropertiesPanel, { props: { ...props, readOnly: false } });
    expect(editor.get('input[data-field="elevation"]').attributes('readonly')).toBeUndefined();
  });
});

describe('a control', () => {
  const inside = (readOnly: boolean, child: () => ReturnType<typeof h>) =>
    mount(
      defineComponent({
        setup() {
          provideReadOnly(readOnly);
          return child;
        },
      }),
    );

  it('keeps a readonly of its own over its editor', () => {
    const open = inside(true, () => h(NumberField, { modelValue: 1, readonly: false }));
    expect(open.get('input').attributes('readonly')).toBeUndefined();
    const shut = inside(false, () => h(NumberField, { modelValue: 1, readonly: true }));
    expect(shut.get('input').attributes('readonly')).toBeDefined();
  });

  it('can be changed when no editor holds it', () => {
    const w = mount(FormSelect, { props: { modelValue: 'a', options: [{ label: 'A', value: 'a' }] } });
    expect(w.classes('q-field--readonly')).toBe(false);
    expect(
      mount(NumberField, { props: { modelValue: 1 } })
        .get('input')
        .attributes('readonly'),
    ).toBeUndefined();
  });
});
