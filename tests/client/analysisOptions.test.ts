// The analysis options dialog: a lead changes the options; anyone else reads them and is told who can
// change them, instead of "results are worked out again when you save" beside disabled controls.
import { afterEach, describe, expect, it } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import AnalysisOptionsDialog from '@/components/building/AnalysisOptionsDialog.vue';

async function mountDialog(editable: boolean) {
  const pinia = createPinia();
  setActivePinia(pinia);
  const w = mount(AnalysisOptionsDialog, {
    props: { modelValue: true, editable },
    global: { plugins: [pinia] },
    attachTo: document.body,
  });
  await flushPromises();
  return w;
}
const caption = () => document.querySelector('[data-test="options-caption"]')?.textContent?.trim() ?? '';
const buttons = () =>
  [...document.querySelectorAll('.q-dialog .q-card__actions .q-btn')].map((b) => b.textContent?.trim());

afterEach(() => {
  document.body.innerHTML = '';
});

describe('analysis options dialog', () => {
  it('tells someone who may not change the options who can, and offers only Close', async () => {
    const w = await mountDialog(false);
    expect(caption()).toContain('Only a lead engineer can change them');
    expect(caption()).not.toContain('when you save');
    expect(buttons()).toEqual(['Close']);
    w.unmount();
  });

  it('tells a lead that saving works the results out again', async () => {
    const w = await mountDialog(true);
    expect(caption()).toContain('results are worked out again when you save');
    expect(buttons()).toEqual(['Cancel', 'Save']);
    w.unmount();
  });
});

describe('buckling lengths option', () => {
  it('offers tabulated factors (chosen by default) and the critical buckling analysis', async () => {
    const w = await mountDialog(true);
    const group = document.querySelector('[data-test="buckling-lengths"]');
    const labels = [...(group?.querySelectorAll('.q-radio') ?? [])].map((r) => r.textContent?.trim() ?? '');
    expect(labels).toHaveLength(2);
    expect(labels[0]).toMatch(/^Tabulated factors/);
    expect(labels[1]).toMatch(/^Critical buckling analysis/);
    const checked = [...(group?.querySelectorAll('.q-radio') ?? [])].map((r) => r.getAttribute('aria-checked'));
    expect(checked).toEqual(['true', 'false']);
    w.unmount();
  });

  it('is named in the options summary', async () => {
    const { optionsSummary } = await import('@/components/building/optionsSummary.ts');
    const base = { combination: '6.10ab', annex: 'UK', imposedReduction: true, selfWeight: true } as const;
    expect(optionsSummary(base)).toContain('tabulated buckling-length factors');
    expect(optionsSummary({ ...base, bucklingLengths: 'critical' })).toContain(
      'buckling lengths from a critical buckling analysis',
    );
  });
});
