// The column schedule page (its tonnage as the API gives it, a print without the app's chrome) and a stack's
// history with the stack as it was, as a viewer sees them.
import { expect, it } from 'vitest';
import { DEMO, describeInBrowser, openDemoBuilding, openStack, screenshot, useAppAndBrowser } from './harness.ts';

describeInBrowser('column schedule and stack history', () => {
  const session = useAppAndBrowser();

  it('shows the schedule with the tonnage of the API and prints only the schedule', async () => {
    const page = await session.pageAs(DEMO.viewer);
    await openDemoBuilding(page);
    await page.locator('[data-test="open-schedule"]').click();
    await page.waitForURL(/\/buildings\/\d+\/schedule$/);
    const table = page.locator('[data-test="schedule-table"]');
    await table.waitFor();
    const api = await page.evaluate(async () => {
      const headers = { Authorization: `Bearer ${localStorage.getItem('stanchion.token')}` };
      const id = location.pathname.split('/')[2];
      return (await (await fetch(`/api/buildings/${id}/schedule`, { headers })).json()) as {
        rows: unknown[];
        tonnage: { total: number };
      };
    });
    expect(api.rows.length).toBeGreaterThan(0);
    await expect(table.locator('tbody tr').count()).resolves.toBe(api.rows.length);
    await expect(page.locator('[data-test="tonnage-total"]').textContent()).resolves.toBe(
      `${(api.tonnage.total / 1000).toFixed(3)} t`,
    );
    await screenshot(page, 'column-schedule');

    await page.emulateMedia({ media: 'print' });
    await expect(page.locator('.q-header').isVisible()).resolves.toBe(false);
    await expect(page.locator('[data-test="schedule-csv"]').isVisible()).resolves.toBe(false);
    await expect(table.isVisible()).resolves.toBe(true);
    await page.emulateMedia({ media: 'screen' });

    const download = page.waitForEvent('download');
    await page.locator('[data-test="schedule-dxf"]').click();
    expect((await download).suggestedFilename()).toMatch(/-column-schedule\.dxf$/);
  });

  it('lists a stack’s versions and shows the stack as it was', async () => {
    const page = await session.pageAs(DEMO.viewer);
    await openDemoBuilding(page);
    await openStack(page, 'A/1');
    await page.locator('[data-test="open-history"]').click();
    const dialog = page.locator('[data-test="history-dialog"]');
    await dialog.getByText('Created the stack').waitFor();
    await dialog.locator('[data-test="history-show"]').last().click();
    const asOf = dialog.locator('[data-test="history-as-of"]');
    await asOf.waitFor();
    await expect(asOf.getByText('Support', { exact: true }).count()).resolves.toBe(1);
    await expect(asOf.getByText('Lift', { exact: true }).count()).resolves.toBeGreaterThan(0);
    await screenshot(page, 'stack-history');
  });
});
