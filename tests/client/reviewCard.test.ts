// The review card shows the steps the server allows and nothing else, and asks for a reason before approving with
// comments open. Invented data of an invented building (id 7).
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia, type Pinia } from 'pinia';
import type { RevisionReview } from '@shared/schema/reviews.ts';
import type { RevisionDetail } from '@shared/schema/revisions.ts';
import ReviewCard from '@/components/revisions/ReviewCard.vue';
import { useRevisionsStore } from '@/stores/revisions.ts';
import { mockFetch } from './fetchMock.ts';

const at = '2026-03-14T09:05:00.000Z';
const revision: RevisionDetail = {
  id: 12,
  buildingId: 7,
  code: 'C01',
  purpose: 'construction',
  note: '',
  frozenAt: at,
  frozenBy: { id: 2, name: 'Preparing Engineer' },
  hash: 'b'.repeat(64),
  stackCount: 1,
  worstUtilisation: 0.7,
  failingLifts: 0,
  mail: { pending: 0, sent: 0, failed: 0 },
  review: {
    state: 'checked',
    prepared: { name: 'Preparing Engineer', at },
    checked: { name: 'Checking Engineer', at },
    approved: null,
    unchecked: false,
    openComments: 1,
  },
  engineVersion: '1.1.0',
  acknowledgement: null,
  options: { combination: '6.10ab', annex: 'UK', imposedReduction: true, selfWeight: true },
  levels: [],
  stacks: [
    {
      id: 4,
      name: 'D/4',
      version: 3,
      governingLiftId: 'lift-1',
      governingLiftLabel: 'L1',
      governingSection: 'UKC 203x203x46',
      utilisation: 0.7,
      status: 'passes',
      lifts: [{ liftId: 'lift-1', label: 'L1' }],
    },
  ],
  recipients: [],
};

const review = (actions: RevisionReview['actions']): RevisionReview => ({
  revisionId: 12,
  code: 'C01',
  state: 'checked',
  prepared: { name: 'Preparing Engineer', at },
  checked: { name: 'Checking Engineer', at },
  approved: null,
  unchecked: false,
  openCommentsReason: null,
  comments: [
    {
      id: 5,
      stackId: 4,
      stack: 'D/4',
      liftId: 'lift-1',
      lift: 'L1',
      text: 'Splice bolts?',
      by: { name: 'Checking Engineer', at },
      resolved: null,
    },
  ],
  actions,
});

/** The same review with its comment resolved. */
const withResolved = (actions: RevisionReview['actions']): RevisionReview => {
  const r = review(actions);
  return { ...r, comments: [{ ...r.comments[0], resolved: { name: 'Checking Engineer', at, note: 'On sheet 4' } }] };
};

let pinia: Pinia;
beforeEach(() => {
  pinia = createPinia();
  setActivePinia(pinia);
  useRevisionsStore().buildingId = 7;
});
afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const byTest = (name: string) => document.body.querySelector<HTMLElement>(`[data-test="${name}"]`);

describe('the review card', () => {
  it('shows the sign-offs and no step buttons to a member the server allows none', async () => {
    mockFetch({
      'GET /api/revisions/12/review': () => ({
        status: 200,
        body: review({ check: false, approve: false, comment: false, resolve: false }),
      }),
    });
    const wrapper = mount(ReviewCard, { props: { revision }, attachTo: document.body, global: { plugins: [pinia] } });
    await flushPromises();
    expect(byTest('sign-off-prepared')?.textContent).toContain('Preparing Engineer');
    expect(byTest('sign-off-checked')?.textContent).toContain('Checking Engineer');
    expect(byTest('sign-off-approved')?.textContent).toContain('awaiting approval');
    for (const button of ['check', 'approve', 'resolve', 'add-comment', 'approve-reason'])
      expect(byTest(button)).toBeNull();
    expect(byTest('comment')?.textContent).toContain('D/4 L1');
    wrapper.unmount();
  });

  it('lets a lead approve with a comment open only with a reason, and sends it', async () => {
    const requests = mockFetch({
      'GET /api/revisions/12/review': () => ({
        status: 200,
        body: review({ check: false, approve: true, comment: true, resolve: true }),
      }),
      'POST /api/revisions/12/approve': () => ({
        status: 200,
        body: { ...review({ check: false, approve: false, comment: false, resolve: false }), state: 'issued' },
      }),
      'GET /api/buildings/7/revisions': () => ({ status: 200, body: [] }),
      'GET /api/revisions/12': () => ({ status: 200, body: revision }),
    });
    const wrapper = mount(ReviewCard, { props: { revision }, attachTo: document.body, global: { plugins: [pinia] } });
    await flushPromises();
    expect(byTest('check')).toBeNull();
    expect(byTest('resolve')).not.toBeNull();
    expect(byTest('approve')?.hasAttribute('disabled')).toBe(true);
    const reason = byTest('approve-reason') as HTMLTextAreaElement | null;
    if (!reason) throw new Error('no reason field');
    reason.value = 'Bolts follow on the connection sheet';
    reason.dispatchEvent(new Event('input'));
    await flushPromises();
    byTest('approve')?.click();
    await flushPromises();
    const approve = requests.find((r) => r.method === 'POST');
    expect(approve?.body).toEqual({ openCommentsReason: 'Bolts follow on the connection sheet' });
    expect(byTest('review-state')?.textContent).toContain('issued');
    wrapper.unmount();
  });

  it('offers to reopen a resolved comment, sends it, and shows it open again', async () => {
    const requests = mockFetch({
      'GET /api/revisions/12/review': () => ({
        status: 200,
        body: withResolved({ check: false, approve: true, comment: true, resolve: true }),
      }),
      'POST /api/revisions/12/comments/5/reopen': () => ({
        status: 200,
        body: review({ check: false, approve: true, comment: true, resolve: true }),
      }),
      'GET /api/buildings/7/revisions': () => ({ status: 200, body: [] }),
      'GET /api/revisions/12': () => ({ status: 200, body: revision }),
    });
    const wrapper = mount(ReviewCard, { props: { revision }, attachTo: document.body, global: { plugins: [pinia] } });
    await flushPromises();
    expect(byTest('resolved')?.textContent).toContain('On sheet 4');
    expect(byTest('resolve')).toBeNull();
    byTest('reopen')?.click();
    await flushPromises();
    expect(requests.filter((r) => r.method === 'POST').map((r) => [r.url, r.body])).toEqual([
      ['/api/revisions/12/comments/5/reopen', {}],
    ]);
    expect(byTest('resolved')).toBeNull();
    expect(byTest('reopen')).toBeNull();
    expect(byTest('resolve')).not.toBeNull();
    wrapper.unmount();
  });

  it('shows a resolved comment without a reopen button to a member who may not resolve', async () => {
    mockFetch({
      'GET /api/revisions/12/review': () => ({
        status: 200,
        body: withResolved({ check: false, approve: false, comment: false, resolve: false }),
      }),
    });
    const wrapper = mount(ReviewCard, { props: { revision }, attachTo: document.body, global: { plugins: [pinia] } });
    await flushPromises();
    expect(byTest('resolved')).not.toBeNull();
    expect(byTest('reopen')).toBeNull();
    wrapper.unmount();
  });
});
