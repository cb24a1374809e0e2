// Nominal moments on screen: the note when a stack has no face reactions, and roof beams given when a
// stack is created, checked with the combination named in the results table (demo data, invented).
import { expect, it } from 'vitest';
import {
  DEMO,
  describeInBrowser,
  liftRow,
  openDemoBuilding,
  openStack,
  results,
  screenshot,
  useAppAndBrowser,
} from './harness.ts';

describeInBrowser('nominal moments on the stack page', () => {
  const session = useAppAndBrowser();

  it('says in the results header when no beam reactions are given on the column faces', async () => {
    const page = await session.pageAs(DEMO.engineer);
    await openDemoBuilding(page);
    await openStack(page, 'C/4');
    const note = results(page).locator('[data-test="moments-note"]');
    await note.waitFor();
    expect(await note.innerText()).toContain('Axial only: no beam reactions given');
    expect(await note.getAttribute('aria-label')).toContain('no beam reactions are given on the column faces');
    await screenshot(page, 'stack-page-no-face-reactions');
  });

  it('creates a stack with roof beams on the cap and shows the combined check of the top lift with its combination', async () => {
    const page = await session.pageAs(DEMO.engineer);
    await openDemoBuilding(page);
    await page.getByRole('button', { name: 'New stack' }).click();
    const dialog = page.locator('.q-dialog');
    await dialog.getByLabel('Grid reference').fill('R/9');
    await dialog.getByText('Beam reactions on the column faces (optional)').click();
    const roof = dialog.locator('[data-test="template-roof-faces"]');
    await roof.locator('input[data-field="faces.yPlus.Gk"]').fill('60');
    await roof.locator('input[data-field="faces.yPlus.Qk"]').fill('20');
    await roof.locator('input[data-field="faces.yPlus.Qk"]').press('Enter');
    const lifts = await dialog.getByLabel(/^Lift \d+:/).count();
    for (let i = 1; i <= lifts; i++) {
      await dialog.getByLabel(new RegExp(`^Lift ${i}:`)).click();
      await page.keyboard.type('UKC 203x203x46', { delay: 10 });
      await page.locator('.q-menu .q-item').filter({ hasText: 'UKC 203x203x46' }).first().click();
    }
    await screenshot(page, 'new-stack-dialog-roof-beams');
    await dialog.getByRole('button', { name: 'Create stack' }).click();
    await page.waitForURL(/\/stacks\/\d+/);
    await results(page).getByText('governs').first().waitFor();
    expect(await results(page).locator('[data-test="moments-note"]').count()).toBe(0);
    // The roof moment goes into the top storey, which belongs to the top lift
    await expect
      .poll(async () => liftRow(page, `L${lifts}`).innerText(), { timeout: 10_000 })
      .toMatch(/\d\.\d\d \(6\.10[ab]\)/);
    await screenshot(page, 'stack-with-roof-beams');
  });
});
