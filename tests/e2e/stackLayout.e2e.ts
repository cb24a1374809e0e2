// The stack page in a small laptop window (1280×720): the editing toolbar stays in view however the
// person scrolls, nothing below it becomes unreachable, and a tall stack opens where an engineer looks
// first — the governing lift, or the top of the stack when it has no results — at a readable zoom.
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { expect, it } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import type { StackSummary, StackTemplate } from '../../shared/schema/api.ts';
import {
  DEMO,
  describeInBrowser,
  graphNode,
  liftRow,
  openDemoBuilding,
  openStack,
  properties,
  results,
  useAppAndBrowser,
} from './harness.ts';

const SMALL = { width: 1280, height: 720 };
const LARGE = { width: 1920, height: 1080 };

/** What the window shows, as the person sees it (harness.screenshot takes the whole page). */
async function viewShot(page: Page, name: string): Promise<void> {
  mkdirSync('test-results', { recursive: true });
  await page.screenshot({ path: path.join('test-results', `${name}.png`) });
}

type Box = { x: number; y: number; width: number; height: number };
async function box(locator: Locator): Promise<Box> {
  const b = await locator.boundingBox();
  if (!b) throw new Error(`${String(locator)} is not drawn`);
  return b;
}
const inside = (b: Box, outer: Box) =>
  b.x >= outer.x - 1 &&
  b.y >= outer.y - 1 &&
  b.x + b.width <= outer.x + outer.width + 1 &&
  b.y + b.height <= outer.y + outer.height + 1;

/** Turns the mouse wheel over an element until nothing more moves, as a person scrolling to the end. */
async function wheelToEnd(page: Page, over: Locator): Promise<void> {
  const b = await box(over);
  await page.mouse.move(b.x + b.width / 2, Math.min(b.y + b.height / 2, page.viewportSize()!.height - 10));
  for (let i = 0; i < 25; i++) {
    await page.mouse.wheel(0, 400);
    await page.waitForTimeout(30);
  }
}

/** Undo and Fit, the first and last of the editing commands, are in the window and not covered. */
async function expectToolbarInView(page: Page): Promise<void> {
  const viewport = { x: 0, y: 0, ...page.viewportSize()! };
  for (const name of ['Undo', 'Fit']) {
    const button = page.getByRole('button', { name, exact: true });
    const b = await box(button);
    expect(
      inside(b, viewport),
      `${name} at ${JSON.stringify(b)} inside the ${viewport.width}×${viewport.height} window`,
    ).toBe(true);
    const onTop = await button.evaluate((el, at) => el.contains(document.elementFromPoint(at.x, at.y)), {
      x: b.x + b.width / 2,
      y: b.y + b.height / 2,
    });
    expect(onTop, `${name} is not covered`).toBe(true);
  }
}

/** The bottom of an element's content is within the window: it was scrolled to its end. */
async function expectEndInView(page: Page, locator: Locator): Promise<void> {
  const b = await box(locator);
  expect(b.y + b.height, `end of ${String(locator)}`).toBeLessThanOrEqual(page.viewportSize()!.height + 1);
}

/** The graph's zoom, read from Vue Flow's transformation pane. */
async function graphZoom(page: Page): Promise<number> {
  return page
    .locator('.vue-flow__transformationpane')
    .evaluate((el) => new DOMMatrix(getComputedStyle(el).transform).a);
}

/** Creates a stack from a template through the real API with the signed-in person's token. */
async function createTallStack(page: Page, name: string, template: Partial<StackTemplate>): Promise<number> {
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

const graphPane = (page: Page) => page.getByRole('region', { name: 'Stack graph' });

/** The graph has panned to the node and ended at the zoom it started from. The pan is animated and
 *  zooms out a little on the way, so the end of it is waited for before the zoom and place are judged. */
async function expectPannedTo(page: Page, node: Locator, zoom: number): Promise<void> {
  const nodeInPane = async () => inside(await box(node), await box(graphPane(page)));
  await expect.poll(nodeInPane, { timeout: 5000 }).toBe(true);
  await expect.poll(() => graphZoom(page), { timeout: 5000 }).toBeCloseTo(zoom, 3);
  expect(await nodeInPane()).toBe(true);
}

describeInBrowser('stack page layout', () => {
  const session = useAppAndBrowser();

  it('keeps the toolbar in view at 1280×720 and 1920×1080 while the results and properties scroll to their ends', async () => {
    const page = await session.pageAs(DEMO.engineer);
    await page.setViewportSize(SMALL);
    await openDemoBuilding(page);
    await openStack(page, 'C/4');
    await viewShot(page, 'stack-layout-1280-open');
    await expectToolbarInView(page);

    // Down through the results to the last thing they show.
    await wheelToEnd(page, results(page));
    await expectEndInView(page, results(page).locator('.results-panel'));
    await expectToolbarInView(page);
    await viewShot(page, 'stack-layout-1280-results-end');

    // A lift picked in the table: its form in the properties pane, scrolled to its last field.
    await liftRow(page, 'L1').click();
    await properties(page).getByText(/./).first().waitFor();
    await wheelToEnd(page, properties(page));
    await expectEndInView(page, properties(page).locator('> *').last());
    await expectToolbarInView(page);
    await viewShot(page, 'stack-layout-1280-properties-end');

    // The page itself: the End key and a wheel over the header move nothing out of sight either.
    await page.keyboard.press('End');
    await wheelToEnd(page, page.locator('.stack-page__head'));
    await expectToolbarInView(page);

    await page.setViewportSize(LARGE);
    await page.reload();
    await results(page).getByText('governs').first().waitFor();
    await expectToolbarInView(page);
    await viewShot(page, 'stack-layout-1920-open');
    await wheelToEnd(page, results(page));
    await expectEndInView(page, results(page).locator('.results-panel'));
    await expectToolbarInView(page);
    await viewShot(page, 'stack-layout-1920-results-end');
  });

  it('opens a 30-storey stack on its governing lift at a readable zoom, and Fit shows all of it', async () => {
    const page = await session.pageAs(DEMO.engineer);
    await page.setViewportSize(SMALL);
    await openDemoBuilding(page);
    // A light bottom lift under heavy ones above: the bottom lift governs, far from the top of the stack.
    const id = await createTallStack(page, 'T/30', {
      storeys: 30,
      storeyHeight: 3.5,
      sections: ['UKC 254x254x73', 'UKC 305x305x240'],
      Gk: 200,
      Qk: 100,
    });
    await page.goto(`${session.app.url}/stacks/${id}`);
    await results(page).getByText('governs').first().waitFor();
    const governing = page.locator('.vue-flow__node').filter({ has: page.locator('.node-card--governing') });
    await expect.poll(() => governing.count()).toBe(1);
    await expect
      .poll(async () => inside(await box(governing), await box(graphPane(page))), { timeout: 5000 })
      .toBe(true);
    expect(await governing.getAttribute('data-id')).toBe('lift-1');
    expect(await graphZoom(page)).toBeGreaterThanOrEqual(0.7);
    await viewShot(page, 'stack-layout-1280-tall-governing');

    // The top lift picked in the results table: the graph pans to it, at the same zoom.
    const zoom = await graphZoom(page);
    expect(inside(await box(graphNode(page, 'lift-15')), await box(graphPane(page)))).toBe(false);
    await liftRow(page, 'L15').click();
    await expectPannedTo(page, graphNode(page, 'lift-15'), zoom);

    // Fit: the cap and the support both inside the pane.
    await page.getByRole('button', { name: 'Fit', exact: true }).click();
    await expect
      .poll(
        async () => {
          const pane = await box(graphPane(page));
          return inside(await box(graphNode(page, 'cap')), pane) && inside(await box(graphNode(page, 'support')), pane);
        },
        { timeout: 5000 },
      )
      .toBe(true);
    await viewShot(page, 'stack-layout-1280-tall-fit');
  });

  it('opens a 30-storey stack without results at its top: the cap in view at a readable zoom', async () => {
    const page = await session.pageAs(DEMO.engineer);
    await page.setViewportSize(SMALL);
    await openDemoBuilding(page);
    // An unknown section: the stack cannot be checked, so there is no governing lift to show.
    const id = await createTallStack(page, 'T/31', {
      storeys: 30,
      storeyHeight: 3.5,
      sections: ['NO SUCH SECTION'],
      Gk: 200,
      Qk: 100,
    });
    await page.goto(`${session.app.url}/stacks/${id}`);
    await results(page).getByText('cannot be checked').waitFor();
    await expect
      .poll(async () => inside(await box(graphNode(page, 'cap')), await box(graphPane(page))), { timeout: 5000 })
      .toBe(true);
    expect(await graphZoom(page)).toBeGreaterThanOrEqual(0.7);
    await viewShot(page, 'stack-layout-1280-tall-top');

    // A restraint added from the palette is drawn by its elevation, far down the template's drawing:
    // the view pans to it, at the same zoom.
    const zoom = await graphZoom(page);
    await graphNode(page, 'cap').click();
    await page.getByRole('toolbar', { name: 'Add a node' }).getByRole('button', { name: 'Restraint' }).click();
    const added = page.locator('.vue-flow__node.selected');
    await expect.poll(() => added.getAttribute('data-id')).toMatch(/^restraint-/);
    await expectPannedTo(page, added, zoom);
    await viewShot(page, 'stack-layout-1280-tall-added');

    await page.setViewportSize(LARGE);
    await page.reload();
    await results(page).getByText('cannot be checked').waitFor();
    await expect
      .poll(async () => inside(await box(graphNode(page, 'cap')), await box(graphPane(page))), { timeout: 5000 })
      .toBe(true);
    await viewShot(page, 'stack-layout-1920-tall-top');
  });
  it('keeps the divider between the graph and the results where the person left it', async () => {
    const page = await session.pageAs(DEMO.engineer);
    await page.setViewportSize(SMALL);
    await openDemoBuilding(page);
    await openStack(page, 'C/4');
    const divider = page.locator('.stack-page__divider');
    const before = await box(graphPane(page));
    const grip = await box(divider);
    await page.mouse.move(grip.x + grip.width / 2, grip.y + grip.height / 2);
    await page.mouse.down();
    await page.mouse.move(grip.x + grip.width / 2, grip.y + grip.height / 2 - 120, { steps: 8 });
    await page.mouse.up();
    const dragged = await box(graphPane(page));
    expect(before.height - dragged.height).toBeGreaterThan(100);

    // The splitter hands over its new place when the drag has ended; the page keeps it in this browser.
    await expect
      .poll(() => page.evaluate(() => localStorage.getItem('stanchion.stackPage.graphShare')), { timeout: 5000 })
      .not.toBeNull();
    await page.reload();
    await results(page).getByText('governs').first().waitFor();
    await expect
      .poll(async () => Math.abs((await box(graphPane(page))).height - dragged.height), { timeout: 5000 })
      .toBeLessThan(3);
  });
});
