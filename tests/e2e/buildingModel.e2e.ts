// The building model in the browser: an engineer draws a grid and a floor build-up, gives a level its floor
// load and places a stack on the grid; the stack's restraint then takes its loads from the floor. When the
// engineer makes that floor heavier, the plan view open in a second browser recolours the stack.
import { expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import {
  DEMO,
  describeInBrowser,
  graphNode,
  openDemoBuilding,
  openStack,
  properties,
  screenshot,
  selectNode,
  useAppAndBrowser,
} from './harness.ts';

describeInBrowser('grid, floor loads and the plan view', () => {
  const session = useAppAndBrowser();

  async function expand(page: Page, label: string): Promise<void> {
    await page.locator('.q-expansion-item .q-item').filter({ hasText: label }).first().click();
  }

  /** Opens the select and picks the option. On a page just navigated back to, the building and its model are
   *  read again and the select drawn anew, which can close a menu opened a moment before: open it again. */
  async function pickOption(page: Page, field: string, option: string): Promise<void> {
    const item = page.locator('.q-menu .q-item').filter({ hasText: option }).first();
    for (let attempt = 1; ; attempt += 1) {
      await page.locator(`[data-test="${field}"]`).click();
      try {
        await item.waitFor({ timeout: 5000 });
        await item.click({ timeout: 5000 });
        return;
      } catch (e) {
        if (attempt === 4) throw e;
        await page.keyboard.press('Escape');
      }
    }
  }

  it("derives a placed stack's loads from the floor and recolours it live in a second browser", async () => {
    const engineer = await session.pageAs(DEMO.engineer);
    await openDemoBuilding(engineer);

    // The grid: A 0, B 6 along x; 1 0, 2 6 along y (the defaults of added lines)
    await expand(engineer, 'Grid');
    for (const dir of ['x', 'x', 'y', 'y']) await engineer.locator(`[data-test="grid-add-${dir}"]`).click();
    await engineer.locator('[data-test="grid-save"]').click();
    await engineer.getByText('Grid saved').waitFor();

    // Two build-ups: an ordinary floor (5 kN/m², 2.5 kN/m² offices) and a very heavy one (150 kN/m²)
    await expand(engineer, 'Floor build-ups');
    await engineer.locator('[data-test="buildup-add"]').click();
    await engineer.locator('input[data-test="buildup-0-gk-0"]').fill('5');
    await engineer.locator('input[data-test="buildup-0-qk"]').fill('2.5');
    await engineer.locator('[data-test="buildup-add"]').click();
    await engineer.locator('input[data-test="buildup-1-gk-0"]').fill('150');
    await engineer.locator('[data-test="buildups-save"]').click();
    await engineer.getByText('Build-ups saved').waitFor();

    await expand(engineer, 'Floor loads by level');
    await pickOption(engineer, 'floor-buildup-Level 1', 'Build-up 1');
    await engineer.locator('[data-test="floor-load-Level 1"]').filter({ hasText: 'Build-up 1' }).waitFor();
    await screenshot(engineer, 'building-model-editors');

    // Place the demo stack A/1 on the crossing A/1 from the plan
    await engineer.locator('[data-test="open-plan"]').click();
    await engineer.waitForURL(/\/plan$/);
    await engineer.getByRole('button', { name: 'Place a stack at A/1' }).dispatchEvent('click');
    await pickOption(engineer, 'place-stack', 'A/1');
    await engineer.locator('[data-test="place-confirm"]').click();
    const marker = engineer.locator('[data-test="plan-stack-A/1"]');
    await marker.waitFor();
    // Pointing and focusing shade alike; focus is what a keyboard user has
    await marker.focus();
    // A corner column of a 6 m grid with no slab beyond the lines carries 3 × 3 = 9 m²
    await engineer.locator('[data-test="plan-tributary"]').waitFor();
    expect(await engineer.locator('[data-test="plan-info"]').innerText()).toContain('9.00 m²');
    await screenshot(engineer, 'plan-view');

    // The stack's Level 1 restraint now takes its loads from the floor: 5 × 9 = 45 kN, 2.5 × 9 = 22.5 kN
    await marker.press('Enter');
    await engineer.waitForURL(/\/stacks\/\d+/);
    await graphNode(engineer, 'restraint-1').waitFor();
    await selectNode(engineer, 'restraint-1');
    const note = properties(engineer).locator('[data-test="floor-load-note"]');
    await note.waitFor();
    expect(await note.innerText()).toMatch(/Gk 45\.0 kN, Qk 22\.5 kN \(B\)/);
    await screenshot(engineer, 'restraint-from-floor');

    // A colleague watches the plan in another browser
    const lead = await session.pageAs(DEMO.lead);
    await openDemoBuilding(lead);
    await lead.locator('[data-test="open-plan"]').click();
    const watched = lead.locator('[data-test="plan-stack-A/1"]');
    await watched.waitFor();
    const before = await watched.getAttribute('data-band');
    expect(before).not.toBe('over');

    // The engineer makes Level 1 very heavy: 150 × 9 = 1350 kN more than the column can carry
    await engineer.goBack();
    await engineer.goBack();
    await engineer.waitForURL(/\/buildings\/\d+$/);
    await expand(engineer, 'Floor loads by level');
    await pickOption(engineer, 'floor-buildup-Level 1', 'Build-up 2');
    await expect.poll(() => watched.getAttribute('data-band'), { timeout: 10_000, interval: 100 }).toBe('over');
    await screenshot(lead, 'plan-view-recoloured');

    // The engineer applies the stack at B/2 as well: one design, B/2 checked with its own floor
    await openStack(engineer, 'A/1');
    await engineer.locator('[data-test="open-positions"]').click();
    await engineer.locator('[data-test="positions-dialog"]').waitFor();
    await pickOption(engineer, 'position-add-x', 'B');
    await pickOption(engineer, 'position-add-y', '2');
    await engineer.locator('[data-test="position-add"]').click();
    const row = engineer.locator('[data-test="position-row-B/2"]');
    await row.waitFor();
    await engineer.locator('[data-test="position-row-A/1"]').waitFor();
    expect(await engineer.locator('[data-test="position-governs"]').count()).toBe(1);
    await screenshot(engineer, 'stack-positions');

    // The plan in the colleague's browser shows both positions, each in its own colour, without a reload
    const second = lead.locator('[data-test="plan-stack-B/2"]');
    await second.waitFor({ timeout: 10_000 });
    await watched.waitFor();
    // B/2 carries Level 1 as heavy as A/1 does (a corner of the same grid): it is over-utilised too
    expect(await second.getAttribute('data-band')).toBe('over');
    expect(await lead.locator('[data-test^="plan-stack-"][data-governs="yes"]').count()).toBe(1);
    await screenshot(lead, 'plan-view-typical-column');

    // A stair void at A/1 on Level 1: half the grid's area there (9 m² → 4.5 m², hand figure), B/2 keeps its own
    const ownRow = engineer.locator('[data-test="position-row-A/1"]');
    await expect.poll(() => ownRow.textContent(), { timeout: 10_000, interval: 100 }).toContain('9.00');
    await engineer.locator('[data-test="position-areas-A/1"]').click();
    await engineer.locator('[data-test="area-override-add"]').click();
    await pickOption(engineer, 'area-override-level', 'Level 1');
    await engineer.locator('input[data-test="area-override-value"]').fill('0.5');
    await engineer.locator('input[data-test="area-override-reason"]').fill('Stair void');
    await engineer.locator('[data-test="area-override-save"]').click();
    await engineer.getByText('Areas saved; the stack is checked with them').waitFor();
    await expect.poll(() => ownRow.textContent(), { timeout: 10_000, interval: 100 }).toContain('4.50');
    expect(await engineer.locator('[data-test="position-overrides-A/1"]').textContent()).toContain('1 level');
    expect(await engineer.locator('[data-test="position-row-B/2"]').textContent()).toContain('9.00');
    await screenshot(engineer, 'stack-own-place-void');
  });
});
