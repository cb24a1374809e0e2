// The graph at true elevation: Fit on a 40-storey stack compresses the vertical scale and draws each node on
// one line, so every lift and splice stays named in type no smaller than 10 px on screen (measured as the
// computed font size × the graph's zoom, and by the drawn box of each label), none hidden under another.
import { expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import type { StackSummary } from '../../shared/schema/api.ts';
import { DEMO, describeInBrowser, openDemoBuilding, results, useAppAndBrowser } from './harness.ts';

type Box = { x: number; y: number; width: number; height: number };

async function createStack(page: Page, name: string, template: object): Promise<number> {
  const buildingId = Number(new URL(page.url()).pathname.split('/')[2]);
  const created = await page.evaluate(
    async ({ buildingId, body }) => {
      const headers = {
        Authorization: `Bearer ${localStorage.getItem('stanchion.token')}`,
        'Content-Type': 'application/json',
      };
      const res = await fetch(`/api/buildings/${buildingId}/stacks`, {
        method: 'POST',
        headers,
        body: JSON.stringify(body),
      });
      return { status: res.status, body: (await res.json()) as StackSummary };
    },
    { buildingId, body: { name, template } },
  );
  expect(created.status).toBe(201);
  return created.body.id;
}

const graphZoom = (page: Page) =>
  page.locator('.vue-flow__transformationpane').evaluate((el) => new DOMMatrix(getComputedStyle(el).transform).a);

/** Each label of a kind: its text, its size on screen (computed font size × zoom) and its drawn box. */
async function labels(page: Page, kind: string): Promise<{ text: string; px: number; box: Box }[]> {
  const zoom = await graphZoom(page);
  return page.locator(`.vue-flow__node-${kind} .node-card__title`).evaluateAll(
    (els, z) =>
      els.map((el) => {
        const r = el.getBoundingClientRect();
        return {
          text: el.textContent?.trim() ?? '',
          px: parseFloat(getComputedStyle(el).fontSize) * z,
          box: { x: r.x, y: r.y, width: r.width, height: r.height },
        };
      }),
    zoom,
  );
}

const inside = (b: Box, outer: Box) =>
  b.x >= outer.x - 1 &&
  b.y >= outer.y - 1 &&
  b.x + b.width <= outer.x + outer.width + 1 &&
  b.y + b.height <= outer.y + outer.height + 1;
const overlap = (a: Box, b: Box) =>
  a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height - 0.5 && b.y < a.y + a.height - 0.5;

describeInBrowser('the graph at true elevation', () => {
  const session = useAppAndBrowser();

  for (const size of [
    { width: 1280, height: 720 },
    { width: 1920, height: 1080 },
  ]) {
    it(`Fit on a 40-storey stack names every lift and splice readably at ${size.width}×${size.height}`, async () => {
      const page = await session.pageAs(DEMO.engineer);
      await page.setViewportSize(size);
      await openDemoBuilding(page);
      const id = await createStack(page, `T/40-${size.width}`, {
        storeys: 40,
        storeyHeight: 3.5,
        spliceEvery: 2,
        sections: ['UKC 305x305x240', 'UKC 254x254x73'],
        Gk: 120,
        Qk: 60,
      });
      await page.goto(`${session.app.url}/stacks/${id}`);
      await results(page).getByText('governs').first().waitFor();
      await page.getByRole('button', { name: 'Fit', exact: true }).click();
      await page.getByRole('button', { name: 'Full scale' }).waitFor();
      const pane = await page.getByRole('region', { name: 'Stack graph' }).boundingBox();
      if (!pane) throw new Error('no graph pane');
      await expect
        .poll(async () => (await labels(page, 'lift')).every((l) => inside(l.box, pane)), { timeout: 5000 })
        .toBe(true);

      const lifts = await labels(page, 'lift');
      const splices = await labels(page, 'splice');
      expect(lifts).toHaveLength(20);
      expect(splices).toHaveLength(19);
      expect(lifts.map((l) => l.text).sort()).toEqual(Array.from({ length: 20 }, (_, i) => `Lift L${i + 1}`).sort());
      for (const l of [...lifts, ...splices]) {
        expect(l.px, `${l.text} font on screen`).toBeGreaterThanOrEqual(10);
        expect(inside(l.box, pane), `${l.text} inside the graph pane`).toBe(true);
        expect(l.box.height, `${l.text} drawn`).toBeGreaterThan(8);
      }
      const all = [...lifts, ...splices];
      for (let i = 0; i < all.length; i++) {
        for (let j = i + 1; j < all.length; j++)
          expect(overlap(all[i].box, all[j].box), `${all[i].text} clear of ${all[j].text}`).toBe(false);
      }
      // The connections stay drawn: one edge up the spine per lift end
      expect(await page.locator('.vue-flow__edge').count()).toBeGreaterThanOrEqual(39);
      await page.screenshot({ path: `test-results/graph-fit-40-${size.width}.png` });

      await page.getByRole('button', { name: 'Full scale' }).click();
      await expect.poll(async () => (await labels(page, 'lift'))[0]?.px ?? 0).toBeGreaterThanOrEqual(10);
      await page.context().close();
    });
  }
});
