// The import dialog (docs/contracts.md §Imports): the file is checked at once, problems are listed by row with the
// Import button off, a clean preview shows a table of what changes, and Import sends the checked file back with
// the preview's hash and version basis.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import type { LoadsPreview } from '@shared/schema/imports.ts';
import ImportDialog from '@/components/imports/ImportDialog.vue';
import { loadChangeRows, problemsByRow, sectionChangeRows } from '@/components/imports/changeRows.ts';

interface Sent {
  method: string;
  url: string;
  form: FormData | null;
}

/** fetch stand-in that keeps the FormData of each upload, answering from a table of routes. */
function stubFetch(routes: Record<string, () => { status: number; body: unknown }>): Sent[] {
  const sent: Sent[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: string, init?: RequestInit) => {
      const method = init?.method ?? 'GET';
      sent.push({ method, url: input, form: init?.body instanceof FormData ? init.body : null });
      const route = routes[`${method} ${input}`];
      const res = route
        ? route()
        : { status: 404, body: { error: { code: 'not_found', message: `No route ${method} ${input}` } } };
      return new Response(JSON.stringify(res.body), {
        status: res.status,
        headers: { 'Content-Type': 'application/json' },
      });
    }),
  );
  return sent;
}

// Invented building: stack A/1, restraint-1 at Level 1.
const clean: LoadsPreview = {
  kind: 'loads',
  fileHash: 'a'.repeat(64),
  rows: 2,
  unchanged: 1,
  changes: [
    {
      row: 2,
      stack: 'A/1',
      stackId: 11,
      level: 'Level 1',
      restraintId: 'restraint-1',
      before: { Gk: 100, Qk: 50, category: 'B' },
      after: { Gk: 150, Qk: 50, category: 'C' },
    },
  ],
  problems: [],
  basis: [{ stackId: 11, version: 4 }],
};
const withProblems: LoadsPreview = {
  ...clean,
  changes: [],
  problems: [
    { row: 3, column: 'Gk_kN', message: '"lots" is not a number (use a point for decimals, e.g. 12.5)' },
    { row: 2, column: 'stack', message: 'No stack "Z/9" in this building' },
    { row: 3, column: 'category', message: '"F" is not an imposed-load category' },
  ],
};

async function mountDialog() {
  const pinia = createPinia();
  setActivePinia(pinia);
  const w = mount(ImportDialog, {
    props: { modelValue: true, buildingId: 7, kind: 'loads' },
    global: { plugins: [pinia] },
    attachTo: document.body,
  });
  await flushPromises();
  return w;
}

async function pick(w: Awaited<ReturnType<typeof mountDialog>>, text: string) {
  w.findComponent({ name: 'QFile' }).vm.$emit('update:modelValue', new File([text], 'loads.csv', { type: 'text/csv' }));
  await flushPromises();
}

const inDialog = (selector: string) => document.body.querySelector(selector);
const buttonOf = (test: string) => inDialog(`[data-test="${test}"]`) as HTMLButtonElement | null;

describe('import dialog', () => {
  beforeEach(() => localStorage.clear());
  afterEach(() => {
    vi.unstubAllGlobals();
    document.body.innerHTML = '';
  });

  it('lists the problems of a refused file by row, in file order, and keeps Import off', async () => {
    const sent = stubFetch({
      'POST /api/buildings/7/imports/loads': () => ({
        status: 422,
        body: {
          error: {
            code: 'unprocessable',
            message: 'The file has 3 problems; nothing was changed',
            details: withProblems,
          },
        },
      }),
    });
    const w = await mountDialog();
    await pick(w, 'stack,level\n');
    expect(sent).toHaveLength(1);
    expect(sent[0]!.form?.get('file')).toBeInstanceOf(File);
    const text = (e: Element) => e.textContent?.replace(/\s+/g, ' ').trim();
    const rows = [...document.body.querySelectorAll('[data-test="problem-row"]')].map((r) => [
      text(r.querySelector('.q-item__section--side')!),
      ...[...r.querySelectorAll('.q-item__label')].map(text),
    ]);
    expect(rows).toEqual([
      ['Row 2', 'stack: No stack "Z/9" in this building'],
      [
        'Row 3',
        'Gk_kN: "lots" is not a number (use a point for decimals, e.g. 12.5)',
        'category: "F" is not an imposed-load category',
      ],
    ]);
    expect(buttonOf('import-apply')?.disabled).toBe(true);
    w.unmount();
  });

  it('shows the changes of a clean file and imports it with the hash and basis of the preview', async () => {
    const sent = stubFetch({
      'POST /api/buildings/7/imports/loads': () => ({ status: 200, body: clean }),
      'POST /api/buildings/7/imports/loads/apply': () => ({
        status: 200,
        body: { applied: 1, stacks: [{ stackId: 11, version: 5 }] },
      }),
    });
    const w = await mountDialog();
    await pick(w, 'stack,level,Gk_kN,Qk_kN,category\nA/1,Level 1,150,50,C\n');
    expect(inDialog('[data-test="import-summary"]')?.textContent).toContain(
      '2 rows checked: 1 would change, 1 already as in the file.',
    );
    const cells = [...document.body.querySelectorAll('[data-test="import-preview"] tbody td')].map((td) =>
      td.textContent?.trim(),
    );
    expect(cells).toEqual(['2', 'A/1', 'Level 1', '100 → 150', '50', 'B → C']);

    buttonOf('import-apply')!.click();
    await flushPromises();
    const apply = sent.find((r) => r.url.endsWith('/apply'))!;
    expect(apply.form?.get('fileHash')).toBe(clean.fileHash);
    expect(JSON.parse(String(apply.form?.get('basis')))).toEqual(clean.basis);
    expect(apply.form?.get('file')).toBeInstanceOf(File);
    expect(inDialog('[data-test="import-summary"]')?.textContent).toContain('1 imported');
    w.unmount();
  });

  it('says so when the building changed since the check', async () => {
    stubFetch({
      'POST /api/buildings/7/imports/loads': () => ({ status: 200, body: clean }),
      'POST /api/buildings/7/imports/loads/apply': () => ({
        status: 409,
        body: {
          error: { code: 'conflict', message: 'Some stacks have changed since the preview; preview the file again' },
        },
      }),
    });
    const w = await mountDialog();
    await pick(w, 'x');
    buttonOf('import-apply')!.click();
    await flushPromises();
    expect(inDialog('[data-test="import-failure"]')?.textContent).toMatch(
      /changed since the preview.*Check the file again/,
    );
    w.unmount();
  });
});

describe('preview rows', () => {
  it('shows a value that stays once and a changed one as before → after', () => {
    expect(loadChangeRows(clean.changes)).toEqual([
      { key: '11/restraint-1', row: 2, stack: 'A/1', level: 'Level 1', Gk: '100 → 150', Qk: '50', category: 'B → C' },
    ]);
  });

  it('names a square hollow section SHS and marks new and changed sections', () => {
    const rows = sectionChangeRows([
      {
        row: 2,
        designation: 'OWN SHS',
        before: null,
        after: { shape: 'RHS', make: 'hot-finished', h: 150, b: 150, t: 8 },
      },
      {
        row: 3,
        designation: 'OWN TUBE',
        before: { shape: 'CHS', make: 'cold-formed', d: 168.3, t: 5 },
        after: { shape: 'CHS', make: 'cold-formed', d: 168.3, t: 6.3 },
      },
    ]);
    expect(rows.map((r) => [r.status, r.shape, r.dims])).toEqual([
      ['new', 'SHS, hot-finished', 'h 150 · b 150 · t 8'],
      ['changed', 'CHS, cold-formed', 'd 168.3 · t 5 → d 168.3 · t 6.3'],
    ]);
  });

  it('groups problems by row, the file as a whole (row 0) first', () => {
    const groups = problemsByRow([
      { row: 4, column: 'level', message: 'b' },
      { row: 0, column: null, message: 'a' },
      { row: 4, column: 'stack', message: 'c' },
    ]);
    expect(groups).toEqual([
      { row: 0, items: [{ column: null, message: 'a' }] },
      {
        row: 4,
        items: [
          { column: 'level', message: 'b' },
          { column: 'stack', message: 'c' },
        ],
      },
    ]);
  });
});
