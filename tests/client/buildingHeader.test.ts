import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import { createMemoryHistory, createRouter } from 'vue-router';
import { defineComponent, h } from 'vue';
import type { Building } from '@shared/schema/api.ts';
import { DEFAULT_ANALYSIS_OPTIONS } from '@shared/schema/results.ts';
import BuildingHeader from '@/components/building/BuildingHeader.vue';

const Stub = defineComponent(() => () => h('div'));

// Invented demo building.
const building: Building = {
  id: 7,
  name: 'Demo office block',
  reference: 'D-001',
  role: 'lead',
  stackCount: 0,
  worstUtilisation: null,
  updatedAt: '2026-03-14T09:05:00.000Z',
  options: DEFAULT_ANALYSIS_OPTIONS,
};

async function mountHeader(roles: { canEdit: boolean; isLead: boolean }) {
  const router = createRouter({
    history: createMemoryHistory(),
    routes: ['buildings', 'plan', 'revisions', 'schedule'].map((name) => ({
      path: name === 'buildings' ? '/buildings' : `/buildings/:id/${name}`,
      name,
      component: Stub,
    })),
  });
  await router.push('/buildings');
  return mount(BuildingHeader, { props: { building, ...roles }, global: { plugins: [router] } });
}

const labels = (wrapper: Awaited<ReturnType<typeof mountHeader>>) =>
  wrapper.findAll('.q-btn').map((b) => b.find('.block').text());

describe('building header', () => {
  it('shows a lead who may edit every button, the new stack last and filled', async () => {
    const wrapper = await mountHeader({ canEdit: true, isLead: true });
    expect(labels(wrapper)).toEqual([
      'Plan',
      'Revisions',
      'Column schedule',
      'Analysis options',
      'Members',
      'New stack',
    ]);
    const buttons = wrapper.findAll('.q-btn');
    expect(buttons.map((b) => b.classes('q-btn--outline'))).toEqual([true, true, true, true, true, false]);
    expect(buttons[5].classes('q-btn--unelevated')).toBe(true);
  });

  it('shows a viewer neither members nor a new stack', async () => {
    const wrapper = await mountHeader({ canEdit: false, isLead: false });
    expect(labels(wrapper)).toEqual(['Plan', 'Revisions', 'Column schedule', 'Analysis options']);
  });

  it("links to the building's pages by its id", async () => {
    const wrapper = await mountHeader({ canEdit: false, isLead: false });
    expect(wrapper.find('[data-test="open-plan"]').attributes('href')).toBe('/buildings/7/plan');
    expect(wrapper.find('[data-test="open-schedule"]').attributes('href')).toBe('/buildings/7/schedule');
    expect(wrapper.findAll('a.q-btn').map((a) => a.attributes('href'))).toContain('/buildings/7/revisions');
  });

  it('asks the page for its dialogs and for a new stack', async () => {
    const wrapper = await mountHeader({ canEdit: true, isLead: true });
    const button = (label: string) => wrapper.findAll('.q-btn').find((b) => b.find('.block').text() === label);
    await button('Analysis options')?.trigger('click');
    await button('Members')?.trigger('click');
    await button('New stack')?.trigger('click');
    expect(wrapper.emitted('options')).toHaveLength(1);
    expect(wrapper.emitted('members')).toHaveLength(1);
    expect(wrapper.emitted('new-stack')).toHaveLength(1);
  });
});
