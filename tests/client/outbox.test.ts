import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia, type Pinia } from 'pinia';
import { createMemoryHistory, createRouter } from 'vue-router';
import { defineComponent, h } from 'vue';
import { QLayout, QPageContainer } from 'quasar';
import type { OutboxMessage } from '@shared/schema/outbox.ts';
import OutboxPage from '@/pages/OutboxPage.vue';
import { formatFileSize } from '@/components/outbox/fileSize.ts';
import { setToken } from '@/api/http.ts';
import { mockFetch } from './fetchMock.ts';

// Invented messages to invented addresses; the older one is listed first, as a server might.
const invitation: OutboxMessage = {
  id: 4,
  to: 'new.member@example.test',
  subject: 'You have been added to Demo block',
  text: 'You can now open Demo block as an engineer.',
  html: null,
  attachments: [],
  createdAt: '2026-03-14T09:05:00.000Z',
};
const revisionNotice: OutboxMessage = {
  id: 5,
  to: 'viewer@example.test',
  subject: 'Revision P01 of Demo block',
  text: 'Revision P01 has been frozen.\nThe calculation package is attached.',
  html: '<p>Revision <b>P01</b></p><script>window.parent.postMessage("escaped", "*")</script>',
  attachments: [{ filename: 'demo-block-P01.pdf', contentType: 'application/pdf', size: 153_600 }],
  createdAt: '2026-03-14T10:30:00.000Z',
};

let pinia: Pinia;
beforeEach(() => {
  localStorage.clear();
  pinia = createPinia();
  setActivePinia(pinia);
});
afterEach(() => {
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
  document.body.innerHTML = '';
});

async function mountPage() {
  const router = createRouter({
    history: createMemoryHistory(),
    routes: [{ path: '/outbox', name: 'outbox', component: OutboxPage }],
  });
  await router.push('/outbox');
  // QPage must sit inside a QLayout; a minimal host gives it one.
  const Host = defineComponent(() => () => h(QLayout, null, () => h(QPageContainer, null, () => h(OutboxPage))));
  const wrapper = mount(Host, { attachTo: document.body, global: { plugins: [pinia, router] } });
  await flushPromises();
  return wrapper;
}

describe('the outbox page', () => {
  it('lists captured e-mails newest first with UTC date, recipient, subject and attachment sizes', async () => {
    mockFetch({ 'GET /api/dev/outbox': () => ({ status: 200, body: [invitation, revisionNotice] }) });
    const wrapper = await mountPage();
    const rows = wrapper.findAll('[data-test="outbox-row"]');
    expect(rows.map((r) => r.text().slice(0, 16))).toEqual(['2026-03-14 10:30', '2026-03-14 09:05']);
    expect(rows[0].text()).toContain('viewer@example.test');
    expect(rows[0].text()).toContain('Revision P01 of Demo block');
    expect(rows[0].text()).toContain('demo-block-P01.pdf (150.0 KiB)');
    expect(wrapper.find('[data-test="dev-note"]').text()).toContain('off in production');
    wrapper.unmount();
  });

  it('opens a message with its text body, and shows the HTML body only in an iframe with an empty sandbox', async () => {
    mockFetch({ 'GET /api/dev/outbox': () => ({ status: 200, body: [invitation, revisionNotice] }) });
    const wrapper = await mountPage();
    await wrapper.findAll('[data-test="outbox-row"]')[0].trigger('click');
    expect(wrapper.find('[data-test="message-subject"]').text()).toBe('Revision P01 of Demo block');
    expect(wrapper.find('[data-test="message-text"]').text()).toBe(revisionNotice.text);

    await wrapper.find('[data-test="html-tab"]').trigger('click');
    const frame = wrapper.find('iframe[data-test="message-html"]');
    expect(frame.attributes('sandbox')).toBe('');
    expect(frame.attributes('srcdoc')).toBe(revisionNotice.html);
    // The markup stays inside the frame's srcdoc: nothing of it reaches the page's own DOM.
    expect(wrapper.find('[data-test="outbox-message"] b').exists()).toBe(false);
    expect(document.querySelectorAll('script')).toHaveLength(0);

    await wrapper.findAll('[data-test="outbox-row"]')[1].trigger('click');
    expect(wrapper.find('[data-test="message-text"]').text()).toBe(invitation.text);
    expect(wrapper.find('[data-test="html-tab"]').exists()).toBe(false);
    wrapper.unmount();
  });

  it('opens a message from the keyboard with Enter or Space, and marks its row as the selected one', async () => {
    mockFetch({ 'GET /api/dev/outbox': () => ({ status: 200, body: [invitation, revisionNotice] }) });
    const wrapper = await mountPage();
    const row = (n: number) => wrapper.findAll('[data-test="outbox-row"]')[n];
    expect(row(1).attributes('tabindex')).toBe('0');
    await row(1).trigger('keydown', { key: ' ' });
    expect(wrapper.find('[data-test="message-subject"]').text()).toBe(invitation.subject);
    expect(row(1).attributes('aria-selected')).toBe('true');
    expect(row(0).attributes('aria-selected')).toBe('false');
    await row(0).trigger('keydown', { key: 'Enter' });
    expect(wrapper.find('[data-test="message-subject"]').text()).toBe(revisionNotice.subject);
    expect(row(0).attributes('aria-selected')).toBe('true');
    wrapper.unmount();
  });

  it('downloads an attachment with the bearer token and saves it under its own name', async () => {
    setToken('tok-admin');
    const requests = mockFetch({
      'GET /api/dev/outbox': () => ({ status: 200, body: [revisionNotice] }),
      'GET /api/dev/outbox/5/attachments/0': () => ({ status: 200, body: '%PDF-1.7' }),
    });
    const createObjectURL = vi.fn((blob: Blob) => `blob:test/${blob.size}`);
    vi.stubGlobal('URL', Object.assign(URL, { createObjectURL, revokeObjectURL: vi.fn() }));
    const saved: string[] = [];
    vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      saved.push(this.download);
    });
    const wrapper = await mountPage();
    await wrapper.find('[data-test="outbox-row"]').trigger('click');
    await wrapper.find('[data-test="attachment"]').trigger('click');
    await flushPromises();
    const download = requests.find((r) => r.url === '/api/dev/outbox/5/attachments/0');
    expect(download?.authorization).toBe('Bearer tok-admin');
    expect(createObjectURL).toHaveBeenCalledTimes(1);
    expect(saved).toEqual(['demo-block-P01.pdf']);
    wrapper.unmount();
  });

  it('says so when nothing has been captured', async () => {
    mockFetch({ 'GET /api/dev/outbox': () => ({ status: 200, body: [] }) });
    const wrapper = await mountPage();
    expect(wrapper.find('[data-test="outbox-empty"]').text()).toContain('No e-mail captured yet');
    expect(wrapper.find('[data-test="outbox-table"]').exists()).toBe(false);
    wrapper.unmount();
  });

  it("shows the server's refusal with a way to try again", async () => {
    mockFetch({
      'GET /api/dev/outbox': () => ({
        status: 403,
        body: { error: { code: 'forbidden', message: 'Only a site admin may do this' } },
      }),
    });
    const wrapper = await mountPage();
    expect(wrapper.find('[role="alert"]').text()).toContain('Only a site admin may do this');
    expect(wrapper.findAll('button').some((b) => b.text().includes('Try again'))).toBe(true);
    wrapper.unmount();
  });

  it('refuses a reply that does not match the outbox contract instead of drawing it', async () => {
    mockFetch({ 'GET /api/dev/outbox': () => ({ status: 200, body: [{ ...invitation, attachments: 'none' }] }) });
    const wrapper = await mountPage();
    expect(wrapper.find('[role="alert"]').text()).toContain('Try again');
    expect(wrapper.find('[data-test="outbox-row"]').exists()).toBe(false);
    wrapper.unmount();
  });
});

describe('attachment sizes', () => {
  // IEC 80000-13: 1 KiB = 1024 B, 1 MiB = 1024 KiB.
  it('prints whole bytes below a kibibyte and one decimal in KiB and MiB above', () => {
    expect(formatFileSize(0)).toBe('0 B');
    expect(formatFileSize(1023)).toBe('1023 B');
    expect(formatFileSize(1536)).toBe('1.5 KiB');
    expect(formatFileSize(3 * 1024 * 1024)).toBe('3.0 MiB');
  });
});
