// An engineer creates a stack from a template, sets sections and loads, and
// sees the results and the governing lift change — in the real app, in headless Chromium.
import { expect, it } from 'vitest';
import {
  DEMO,
  describeInBrowser,
  governingLift,
  graphNode,
  liftRow,
  liftUtilisation,
  openDemoBuilding,
  openStack,
  pickSection,
  properties,
  results,
  screenshot,
  selectNode,
  useAppAndBrowser,
} from './harness.ts';

describeInBrowser('an engineer at work', () => {
  const session = useAppAndBrowser();

  it('changes a lift section in the properties pane and sees its utilisation and the governing highlight change', async () => {
    const page = await session.pageAs(DEMO.engineer);
    await openDemoBuilding(page);
    await screenshot(page, 'building-page');
    await openStack(page, 'C/4');
    await screenshot(page, 'stack-page');
    const before = await governingLift(page);
    expect(before).toBe('L3');
    const l1Before = await liftUtilisation(page, 'L1');
    // L1 down to a much lighter section: its utilisation rises past every other lift's.
    // Selecting the lift's row in the results selects it in the graph and the properties pane too.
    await liftRow(page, 'L1').click();
    await pickSection(page, 'UKC 254x254x73');
    await expect.poll(() => liftUtilisation(page, 'L1'), { timeout: 10_000 }).toBeGreaterThan(l1Before);
    await expect.poll(() => governingLift(page), { timeout: 10_000 }).toBe('L1');
    await graphNode(page, 'lift-1').locator('.node-card--governing').waitFor({ timeout: 5000 });
    await screenshot(page, 'stack-page-after-edit');
  });

  it("creates a stack at the building's levels, sets a floor load and sees results with a governing lift", async () => {
    const page = await session.pageAs(DEMO.engineer);
    await openDemoBuilding(page);
    await page.getByRole('button', { name: 'New stack' }).click();
    const dialog = page.locator('.q-dialog');
    await dialog.getByLabel('Grid reference').fill('E/7');
    // The demo building has levels, so the floors follow them by default: Ground up to Level 4 is 4 storeys.
    await dialog.getByLabel('Top level').click();
    await page.locator('.q-menu .q-item').filter({ hasText: 'Level 4' }).click();
    await dialog.getByText('4 storeys between them').waitFor();
    await dialog.getByLabel('Permanent load per floor, Gk (kN)').fill('150');
    await dialog.getByLabel('Imposed load per floor, Qk (kN)').fill('75');
    for (const [lift, section] of [
      ['Lift 1', 'UKC 203x203x60'],
      ['Lift 2', 'UKC 203x203x46'],
    ]) {
      await dialog.getByLabel(new RegExp(`^${lift}:`)).click();
      await page.keyboard.type(section, { delay: 10 });
      await page.locator('.q-menu .q-item').filter({ hasText: section }).first().click();
    }
    await screenshot(page, 'new-stack-dialog');
    await dialog.getByRole('button', { name: 'Create stack' }).click();
    await page.waitForURL(/\/stacks\/\d+/);
    await results(page).getByText('governs').first().waitFor();
    const lowest = await liftUtilisation(page, 'L1');
    // A heavier floor load on the first restraint raises the force in every lift below it.
    await selectNode(page, 'restraint-1');
    // The floor is tied to Level 1, so its elevation is set by the level.
    await properties(page).locator('[data-test="untie-level"]').waitFor();
    const gk = properties(page).getByLabel('Permanent load Gk (kN)');
    await gk.fill('900');
    await gk.press('Enter');
    await expect.poll(() => liftUtilisation(page, 'L1'), { timeout: 10_000 }).toBeGreaterThan(lowest);
    expect(await governingLift(page)).toMatch(/^L\d$/);
    await screenshot(page, 'new-stack-results');
  });
});
