// A lead switches the demo building to buckling lengths from the critical buckling analysis and sees,
// in a stack's results, the buckled shape of the stack beside the selected lift's working.
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

describeInBrowser('buckling lengths from the critical buckling analysis', () => {
  const session = useAppAndBrowser();

  it('a lead chooses the analysis in the options; a lift’s working shows the buckled shape with αcr and the tabulated factors', async () => {
    const page = await session.pageAs(DEMO.lead);
    await openDemoBuilding(page);
    await page.getByRole('button', { name: 'Analysis options' }).click();
    await page.getByRole('radio', { name: /^Critical buckling analysis/ }).click();
    await page.getByRole('button', { name: 'Save' }).click();
    await page.getByText('Analysis options saved').waitFor();
    await expect
      .poll(() => page.getByText('buckling lengths from a critical buckling analysis').count(), { timeout: 10_000 })
      .toBeGreaterThan(0);
    await openStack(page, 'C/4');
    await liftRow(page, 'L1').click();
    const plot = results(page).locator('[data-test="buckled-shape"]');
    await plot.waitFor({ timeout: 10_000 });
    expect(await plot.locator('polyline').count()).toBe(2);
    expect(await plot.textContent()).toMatch(/y-y: αcr = \d+\.\d\d/);
    await results(page).locator('[data-test="tabulated-k"]').waitFor();
    await plot.scrollIntoViewIfNeeded();
    await screenshot(page, 'stack-critical-buckling');
  });
});
