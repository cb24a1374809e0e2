// Structural edits as single commands, in a real browser: split a lift at an elevation and undo it,
// join two lifts at a splice. Each is one edit, so the results never go blank between steps.
import { expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import {
  DEMO,
  describeInBrowser,
  openDemoBuilding,
  openStack,
  properties,
  results,
  screenshot,
  useAppAndBrowser,
} from './harness.ts';

const liftRows = (page: Page) =>
  results(page)
    .locator('tbody tr')
    .filter({ has: page.locator('td:first-child', { hasText: /^\s*L\d+/ }) });

async function liftCountBecomes(page: Page, n: number): Promise<void> {
  await expect.poll(() => liftRows(page).count(), { timeout: 10_000 }).toBe(n);
  // The results are there (a lift governs), not blank or replaced by errors.
  await results(page).getByText('governs').first().waitFor();
}

/** Selects a node on the graph by keyboard, as a person can (Tab to it, Enter). */
async function selectOnGraph(page: Page, selector: string): Promise<void> {
  const node = page.locator(selector).first();
  await node.focus();
  await page.keyboard.press('Enter');
}

describeInBrowser('structural edits on the stack page', () => {
  const session = useAppAndBrowser();

  it('splits a lift at an elevation in one command, then undoes it in one step', async () => {
    const page = await session.pageAs(DEMO.engineer);
    await openDemoBuilding(page);
    await openStack(page, 'C/4');
    const before = await liftRows(page).count();
    const liftId = await page.locator('.vue-flow__node-lift').first().getAttribute('data-id');
    await selectOnGraph(page, `.vue-flow__node[data-id="${liftId}"]`);
    await page.getByRole('button', { name: 'Split' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.locator('input').fill('2.4');
    await dialog.getByRole('button', { name: 'Split' }).click();
    await liftCountBecomes(page, before + 1);
    expect(await results(page).getByText('+2.400').count()).toBeGreaterThan(0);
    // The new upper lift carries the copied section, flagged until confirmed
    await results(page).getByText('section copied from the lift it was split from').first().waitFor();
    await screenshot(page, 'stack-split-lift');

    await page.getByRole('button', { name: 'Undo' }).click();
    await liftCountBecomes(page, before);
    expect(await results(page).getByText('section copied from the lift it was split from').count()).toBe(0);
    await screenshot(page, 'stack-split-undone');
    await page.context().close();
  });

  it('joins the two lifts at a splice in one command', async () => {
    const page = await session.pageAs(DEMO.engineer);
    await openDemoBuilding(page);
    await openStack(page, 'B/2');
    const before = await liftRows(page).count();
    await selectOnGraph(page, '.vue-flow__node-splice');
    await properties(page)
      .getByText(/splice/i)
      .first()
      .waitFor();
    await page.getByRole('button', { name: 'Join' }).click();
    await liftCountBecomes(page, before - 1);
    await screenshot(page, 'stack-join-lifts');
    await page.context().close();
  });

  it('shows the load take-down per level with n and αn, and the combination that gives NEd', async () => {
    const page = await session.pageAs(DEMO.engineer);
    await openDemoBuilding(page);
    // Imposed load large beside the permanent (invented): eq. 6.10b with a leading imposed load governs, so αn applies.
    const buildingId = Number(new URL(page.url()).pathname.split('/')[2]);
    const status = await page.evaluate(async (id) => {
      const headers = {
        Authorization: `Bearer ${localStorage.getItem('stanchion.token')}`,
        'Content-Type': 'application/json',
      };
      const template = { storeys: 6, storeyHeight: 3.8, sections: ['UKC 305x305x198'], Gk: 60, Qk: 200 };
      return (
        await fetch(`/api/buildings/${id}/stacks`, {
          method: 'POST',
          headers,
          body: JSON.stringify({ name: 'T/1', template }),
        })
      ).status;
    }, buildingId);
    expect(status).toBe(201);
    await page.reload();
    await openStack(page, 'T/1');
    const table = results(page).locator('[data-test="take-down"]');
    await table.scrollIntoViewIfNeeded();
    const headers = (await table.locator('thead th').allInnerTexts()).map((h) => h.trim());
    expect(headers).toEqual(expect.arrayContaining(['n', 'αn', 'Combination']));
    const ns = (await table.locator('td[data-col="n"]').allInnerTexts()).map(Number);
    const alphas = (await table.locator('td[data-col="alphaN"]').allInnerTexts()).map(Number);
    // Where floor load B leads, n counts the loaded floors above: n = 3 gives αn = 1.1 − 3/10 = 0.80 (UK NA to
    // EN 1991-1-1, NA.2.6); lower down the roof load (ψ0,H = 0.7 in the UK NA to EN 1990) leads, unreduced.
    expect(ns.map((n, i) => [n, alphas[i]])).toContainEqual([3, 0.8]);
    expect(ns.map((n, i) => [n, alphas[i]])).toContainEqual([2, 0.9]);
    expect(await table.innerText()).toContain('6.10b, leading');
    // Rows are named by level or place, never by node id
    expect(await table.innerText()).not.toMatch(/restraint-|lift-|splice-/);
    await table.screenshot({ path: 'test-results/stack-take-down.png' });
    await page.context().close();
  });

  it('at 1280×720 the results show at least four lifts without scrolling, the last column whole', async () => {
    const page = await session.pageAs(DEMO.engineer);
    await page.setViewportSize({ width: 1280, height: 720 });
    await openDemoBuilding(page);
    await openStack(page, 'C/4');
    const window = { width: 1280, height: 720 };
    await page.screenshot({ path: 'test-results/stack-results-1280.png' });
    const rows = await liftRows(page).evaluateAll((els) => els.map((el) => el.getBoundingClientRect().bottom));
    expect(rows.filter((bottom) => bottom <= window.height).length).toBeGreaterThanOrEqual(4);
    const last = await results(page).locator('thead th').last().boundingBox();
    const pane = await results(page).boundingBox();
    expect(last && pane && last.x + last.width <= pane.x + pane.width + 1).toBe(true);
    await page.context().close();
  });
});
