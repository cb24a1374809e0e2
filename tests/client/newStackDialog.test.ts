// The new-stack dialog and the stacks' grid references: a grid reference names one column position, so a
// second stack of the same name (in any case) is refused before anything is sent, on creating and on
// renaming; a lift left without a section is marked where it is.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { QSelect } from 'quasar';
import type { Building, Level, StackSummary } from '@shared/schema/api.ts';
import { DEFAULT_ANALYSIS_OPTIONS } from '@shared/schema/results.ts';
import NewStackDialog from '@/components/building/NewStackDialog.vue';
import SectionSelect from '@/components/building/SectionSelect.vue';
import RestraintFacesForm from '@/components/stack/RestraintFacesForm.vue';
import { useBuildingsStore } from '@/stores/buildings.ts';
import { useLevelsStore } from '@/stores/levels.ts';
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

// Invented irregular levels: a tall ground storey, two office storeys, a plant storey under the roof.
const LEVELS: Level[] = [
  { id: '21', name: 'Ground', elevation: 0 },
  { id: '22', name: 'Level 1', elevation: 4.5 },
  { id: '23', name: 'Level 2', elevation: 8 },
  { id: '24', name: 'Level 3', elevation: 11.5 },
  { id: '25', name: 'Roof', elevation: 15.7 },
];

function openStore(levels: Level[] = []) {
  const pinia = createPinia();
  setActivePinia(pinia);
  const store = useBuildingsStore();
  store.current = building;
  store.stacks = [c4];
  useLevelsStore().replace(building.id, levels);
  return { pinia, store };
}

async function mountDialog(levels: Level[] = []) {
  const { pinia, store } = openStore(levels);
  const w = mount(NewStackDialog, {
    props: { modelValue: true },
    global: { plugins: [pinia] },
    attachTo: document.body,
  });
  await flushPromises();
  return { w, store };
}

const field = (label: string) => {
  const input = [...document.querySelectorAll<HTMLInputElement>('.q-dialog input')].find(
    (i) => i.getAttribute('aria-label') === label,
  );
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
const fieldLabels = () =>
  [...document.querySelectorAll('.q-dialog .q-field__label')].map((l) => l.textContent?.trim() ?? '');
const liftLabels = () => fieldLabels().filter((l) => l.startsWith('Lift '));
const levelsToggle = () => document.querySelector<HTMLElement>('.q-dialog [data-test="floors-at-levels"]');

/** Picks a section for every lift as the section picker would, and answers the create and list calls. */
async function fillAndCreate(w: ReturnType<typeof mount>) {
  for (const picker of w.findAllComponents(SectionSelect)) picker.vm.$emit('update:modelValue', 'UKC 203x203x46');
  await type('Grid reference', 'F/3');
  await submit();
}
const created = () => ({
  'POST /api/buildings/7/stacks': () => ({ status: 201, body: { id: 12, name: 'F/3' } }),
  'GET /api/buildings/7/stacks': () => ({ status: 200, body: [c4] }),
});

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

describe("new stack at the building's levels", () => {
  it("offers the levels by default: no storey fields, lifts named by their levels, and the levels' elevations sent", async () => {
    const requests = mockFetch(created());
    const { w } = await mountDialog(LEVELS);
    expect(levelsToggle()?.getAttribute('aria-checked')).toBe('true');
    expect(fieldLabels()).not.toContain('Storeys');
    expect(fieldLabels()).not.toContain('Storey height (m)');
    expect(fieldLabels()).not.toContain('Base elevation (m)');
    // Four storeys spliced every 2: two lifts, Ground to Level 2 and Level 2 to Roof.
    expect(liftLabels()).toEqual([
      'Lift 1: Ground +0.000 to Level 2 +8.000 m',
      'Lift 2: Level 2 +8.000 to Roof +15.700 m',
    ]);
    expect(dialogText()).toContain('4 storeys between them');
    await fillAndCreate(w);
    const post = requests.find((r) => r.method === 'POST');
    expect(post?.body).toEqual({
      name: 'F/3',
      template: {
        elevations: [0, 4.5, 8, 11.5, 15.7],
        spliceEvery: 2,
        sections: ['UKC 203x203x46', 'UKC 203x203x46'],
        grade: 'S355',
        baseFixity: 'pinned',
        Gk: 150,
        Qk: 90,
      },
    });
    expect(w.emitted('created')).toEqual([[12]]);
    w.unmount();
  });

  it('sends beam reactions for every floor and for the roof when given, and none otherwise', async () => {
    const requests = mockFetch(created());
    const { w } = await mountDialog(LEVELS);
    const [floors, roof] = w.findAllComponents(RestraintFacesForm);
    expect(roof.props('roof')).toBe(true);
    floors.vm.$emit('change', { faces: { yPlus: { Gk: 40, Qk: 25 } } });
    roof.vm.$emit('change', { faces: { yPlus: { Gk: 30, Qk: 10 } } });
    await flushPromises();
    await fillAndCreate(w);
    const template = (requests.find((r) => r.method === 'POST')?.body as { template: Record<string, unknown> })
      .template;
    expect(template).toMatchObject({ faces: { yPlus: { Gk: 40, Qk: 25 } }, roofFaces: { yPlus: { Gk: 30, Qk: 10 } } });
    w.unmount();
  });

  it('builds the stack between the chosen bottom and top levels', async () => {
    const requests = mockFetch(created());
    const { w } = await mountDialog(LEVELS);
    const select = (label: string) => w.findAllComponents(QSelect).find((s) => s.props('label') === label)!;
    // The top level offers only levels above the bottom one.
    expect((select('Top level').props('options') as { label: string }[]).map((o) => o.label)).toEqual([
      'Level 1 (+4.500 m)',
      'Level 2 (+8.000 m)',
      'Level 3 (+11.500 m)',
      'Roof (+15.700 m)',
    ]);
    select('Bottom level').vm.$emit('update:modelValue', '22');
    select('Top level').vm.$emit('update:modelValue', '24');
    await flushPromises();
    expect(liftLabels()).toEqual(['Lift 1: Level 1 +4.500 to Level 3 +11.500 m']);
    await fillAndCreate(w);
    expect(
      (requests.find((r) => r.method === 'POST')?.body as { template: { elevations: number[] } }).template.elevations,
    ).toEqual([4.5, 8, 11.5]);
    w.unmount();
  });

  it('turned off, gives the regular template with storeys, storey height and base elevation', async () => {
    const requests = mockFetch(created());
    const { w } = await mountDialog(LEVELS);
    levelsToggle()?.click();
    await flushPromises();
    expect(fieldLabels()).toEqual(expect.arrayContaining(['Storeys', 'Storey height (m)', 'Base elevation (m)']));
    expect(liftLabels()).toEqual(['Lift 1: +0.000 to +7.200 m', 'Lift 2: +7.200 to +14.400 m']);
    await fillAndCreate(w);
    const template = (requests.find((r) => r.method === 'POST')?.body as { template: Record<string, unknown> })
      .template;
    expect(template).toMatchObject({ storeys: 4, storeyHeight: 3.6, baseElevation: 0 });
    expect(template).not.toHaveProperty('elevations');
    w.unmount();
  });

  it('is not offered with fewer than two levels', async () => {
    mockFetch({});
    const { w } = await mountDialog([LEVELS[0]]);
    expect(levelsToggle()).toBeNull();
    expect(fieldLabels()).toContain('Storeys');
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
