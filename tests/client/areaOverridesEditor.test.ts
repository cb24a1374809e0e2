// The editor of areas set by hand at one place on the grid (docs/typical-columns.md): it shows what is set, sends a
// level's area or factor with its reason, and holds back a half-filled row. Figures invented.
import { afterEach, describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import type { AreaOverride } from '@shared/schema/building.ts';
import AreaOverridesEditor from '@/components/stack/positions/AreaOverridesEditor.vue';

const LEVELS = [
  { id: '2', name: 'First', elevation: 4 },
  { id: '3', name: 'Second', elevation: 8 },
];

afterEach(() => {
  document.body.innerHTML = '';
});

function mountEditor(overrides: AreaOverride[], readOnly = false) {
  return mount(AreaOverridesEditor, {
    props: { overrides, levels: LEVELS, readOnly, busy: false },
    attachTo: document.body,
  });
}

const inputs = (w: ReturnType<typeof mountEditor>, test: string) =>
  w.findAll(`[data-test="${test}"] input, input[data-test="${test}"]`);

describe('areas set by hand', () => {
  it('shows the areas set and sends them back with a new level added', async () => {
    const w = mountEditor([{ levelId: '2', factor: 0.5, reason: 'Stair void' }]);
    expect(w.findAll('[data-test^="area-override-"][data-test$="0"]')).toHaveLength(1);
    expect((inputs(w, 'area-override-reason')[0]!.element as HTMLInputElement).value).toBe('Stair void');
    await w.find('[data-test="area-override-add"]').trigger('click');
    const values = inputs(w, 'area-override-value');
    const reasons = inputs(w, 'area-override-reason');
    expect(values).toHaveLength(2);
    // The new row takes the free level (Second) and a factor until told otherwise.
    await values[1]!.setValue('0.75');
    await reasons[1]!.setValue('Riser');
    expect(w.find('[data-test="area-override-problem"]').exists()).toBe(false);
    await w.find('[data-test="area-override-save"]').trigger('click');
    expect(w.emitted('save')).toEqual([
      [
        [
          { levelId: '2', factor: 0.5, reason: 'Stair void' },
          { levelId: '3', factor: 0.75, reason: 'Riser' },
        ],
      ],
    ]);
  });

  it('holds back a row without a value, with a factor beyond the schema or without a reason', async () => {
    const w = mountEditor([]);
    expect(w.find('[data-test="area-overrides-none"]').exists()).toBe(true);
    await w.find('[data-test="area-override-add"]').trigger('click');
    expect(w.find('[data-test="area-override-problem"]').text()).toMatch(/Give Second an area or factor/);
    await inputs(w, 'area-override-value')[0]!.setValue('12');
    expect(w.find('[data-test="area-override-problem"]').text()).toBe('A factor is at most 10');
    await inputs(w, 'area-override-value')[0]!.setValue('0.8');
    expect(w.find('[data-test="area-override-problem"]').text()).toMatch(/Say why Second differs/);
    await w.find('[data-test="area-override-save"]').trigger('click');
    expect(w.emitted('save')).toBeUndefined();
  });

  it('lets a viewer read the areas set but not change them', () => {
    const w = mountEditor([{ levelId: '3', area: 10, reason: 'Plant well' }], true);
    expect(w.find('[data-test="area-override-save"]').exists()).toBe(false);
    expect(w.find('[data-test="area-override-add"]').exists()).toBe(false);
    expect((inputs(w, 'area-override-value')[0]!.element as HTMLInputElement).value).toBe('10');
  });
});
