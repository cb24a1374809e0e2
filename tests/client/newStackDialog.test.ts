// The new-stack dialog and the stacks' grid references: a grid reference names one column position, so a
// second stack of the same name (in any case) is refused before anything is sent, on creating and on
// renaming; a lift left without a section is marked where it is.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import type { Building, StackSummary } from '@shared/schema/api.ts';
import { DEFAULT_ANALYSIS_OPTIONS } from '@shared/schema/results.ts';
import NewStackDialog from '@/components/building/NewStackDialog.vue';
import { useBuildingsStore } from '@/stores/buildings.ts';
import { mockFetch } from './fetchMock.ts';

// Invented demo building with one stack.
const building: Building = {
  id: 7,
  name: 'Demo office block',
  reference: 'D-001',
  role: 'engineer',
  stackCount: 1,
  worstUtilisation: 0.62,
  updatedAt: '2026-03-14T09:05:00.000Z',
  options: DEFAULT_ANALYSIS_OPTIONS,
};
const c4: StackSummary = {
  id: 11,
  buildingId: 7,
  name: 'C/4',
  version: 3,
  liftCount: 2,
  governingLiftId: 'lift-1',
  governingLiftLabel: 'L1',
  governingSection: 'UKC 254x254x89',
  utilisation: 0.62,
  status: 'passes',
  updatedAt: '2026-03-14T09:05:00.000Z',
};

function openStore() {
  const pinia = createPinia();
  setActivePinia(pinia);
  const store = useBuildingsStore();
  store.current = building;
  store.stacks = [c4];
  return { pinia, store };
}

async function mountDialog() {
  const { pinia, store } = openStore();
  const w = mount(NewStackDialog, { props: { modelValue: true }, global: { plugins: [pinia] }, attachTo: document.body });
  await flushPromises();
  return { w, store };
}

const field = (label: string) => {
  const input = [...document.querySelectorAll<HTMLInputElement>('.q-dialog input')].find((i) => i.getAttribute('aria-label') === label);
  if (!input) throw new Error(`no field ${label}`);
  return input;
};
async function type(label: string, text: string) {
  const input = field(label);
  input.value = text;
  input.dispatchEvent(new Event('input'));
  await flushPromises();
}
async function submit() {
  document.querySelector<HTMLFormElement>('.q-dialog form')?.dispatchEvent(new Event('submit'));
  await flushPromises();
}
const dialogText = () => document.querySelector('.q-dialog')?.textContent ?? '';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

describe('new stack dialog', () => {
  it('refuses a grid reference the building already has, whatever its case, without calling the server', async () => {
    const requests = mockFetch({});
    const { w } = await mountDialog();
    await type('Grid reference', 'c/4 ');
    await submit();
    expect(dialogText()).toContain('Stack C/4 is already in this building');
    expect(requests).toHaveLength(0);
    w.unmount();
  });

  it('marks every lift still without a section, not only the first', async () => {
    mockFetch({});
    const { w } = await mountDialog();
    await type('Grid reference', 'D/5');
    await submit();
    const marked = [...document.querySelectorAll('.q-dialog .q-field--error')].map((f) => f.textContent ?? '');
    // The default template: 4 storeys spliced every 2, so two lifts.
    expect(marked.filter((t) => t.includes('Choose a section for every lift'))).toHaveLength(2);
    w.unmount();
  });

  it('says a storey count left empty is required rather than not a number', async () => {
    mockFetch({});
    const { w } = await mountDialog();
    await type('Storeys', '');
    await submit();
    expect(dialogText()).toContain('Storeys is required');
    w.unmount();
  });
});

describe('renaming a stack', () => {
  it('refuses the grid reference of another stack without calling the server, and keeps the old name', async () => {
    const requests = mockFetch({});
    const { store } = openStore();
    store.stacks = [c4, { ...c4, id: 12, name: 'D/5' }];
    expect(await store.renameStack(12, 'C/4')).toBe(false);
    expect(store.stacks.map((s) => s.name)).toEqual(['C/4', 'D/5']);
    expect(requests).toHaveLength(0);
  });

  it('lets a stack keep its own name in another case', async () => {
    const requests = mockFetch({ 'PATCH /api/stacks/11': () => ({ status: 200, body: { ...c4, name: 'c/4' } }) });
    const { store } = openStore();
    expect(await store.renameStack(11, 'c/4')).toBe(true);
    expect(requests.map((r) => r.method)).toEqual(['PATCH']);
  });
});
