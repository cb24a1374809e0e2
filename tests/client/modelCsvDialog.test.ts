// Importing the grid from CSV: a refused file lists its problems by row and keeps Import off; a clean file
// shows every row with what would change, and Import sends the file with the hash of the preview.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import type { GridPreview } from '@shared/schema/imports.ts';
import ModelCsvDialog from '@/components/building/ModelCsvDialog.vue';
import { mockFetch } from './fetchMock.ts';

const HASH = 'a'.repeat(64);
const refused: GridPreview = {
  fileHash: HASH,
  grid: null,
  rows: [],
  problems: [{ row: 3, column: 'direction', message: '"z" is not a direction; use x or y' }],
};
const clean: GridPreview = {
  fileHash: HASH,
  grid: {
    x: { lines: [{ id: 'x1', name: 'A', position: 0 }], edgeBefore: 0, edgeAfter: 0 },
    y: { lines: [{ id: 'y1', name: '1', position: 0 }], edgeBefore: 0, edgeAfter: 0 },
  },
  rows: [
    { row: 2, direction: 'x', name: 'A', position: 0, change: 'new' },
    { row: 3, direction: 'y', name: '1', position: 0, change: 'new' },
  ],
  problems: [],
};

async function mountDialog() {
  setActivePinia(createPinia());
  const w = mount(ModelCsvDialog, {
    props: { modelValue: true, buildingId: 7, kind: 'grid' },
    attachTo: document.body,
  });
  await flushPromises();
  return w;
}

async function pick(w: Awaited<ReturnType<typeof mountDialog>>) {
  w.findComponent({ name: 'QFile' }).vm.$emit(
    'update:modelValue',
    new File(['direction,name,position_m\n'], 'grid.csv', { type: 'text/csv' }),
  );
  await flushPromises();
}

const apply = () => document.body.querySelector('[data-test="model-csv-apply"]') as HTMLButtonElement;

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

describe('grid import dialog', () => {
  it('lists the problems of a refused file by row and keeps Import off', async () => {
    mockFetch({
      'POST /api/buildings/7/imports/grid': () => ({
        status: 422,
        body: { error: { code: 'unprocessable', message: 'The file has 1 problem', details: refused } },
      }),
    });
    const w = await mountDialog();
    await pick(w);
    expect(document.body.querySelector('[data-test="import-problems"]')?.textContent).toContain('Row 3');
    expect(apply().disabled || apply().classList.contains('disabled')).toBe(true);
    w.unmount();
  });

  it('shows each row of a clean file and imports it', async () => {
    const sent = mockFetch({
      'POST /api/buildings/7/imports/grid': () => ({ status: 200, body: clean }),
      'POST /api/buildings/7/imports/grid/apply': () => ({ status: 200, body: {} }),
      'GET /api/buildings/7/model': () => ({
        status: 200,
        body: { grid: clean.grid, buildups: [], floors: [], overrides: {}, version: 2 },
      }),
    });
    const w = await mountDialog();
    await pick(w);
    const rows = [...document.body.querySelectorAll('[data-test="model-csv-preview"] tbody tr')].map(
      (r) => r.textContent,
    );
    expect(rows).toHaveLength(2);
    expect(rows[0]).toContain('A');
    apply().click();
    await flushPromises();
    expect(sent.some((r) => r.method === 'POST' && r.url === '/api/buildings/7/imports/grid/apply')).toBe(true);
    w.unmount();
  });
});
