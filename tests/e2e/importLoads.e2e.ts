// A CSV of level loads with a bad row is refused with the row named, and nothing in
// the building changes.
import { expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO, describeInBrowser, openDemoBuilding, screenshot, useAppAndBrowser } from './harness.ts';

/** Every stack's version, read with the signed-in user's own token. */
async function stackVersions(page: Page): Promise<Record<string, number>> {
  return page.evaluate(async () => {
    const headers = { Authorization: `Bearer ${localStorage.getItem('stanchion.token')}` };
    const id = location.pathname.split('/')[2];
    const stacks = (await (await fetch(`/api/buildings/${id}/stacks`, { headers })).json()) as {
      name: string;
      version: number;
    }[];
    return Object.fromEntries(stacks.map((s) => [s.name, s.version]));
  });
}

describeInBrowser('importing level loads', () => {
  const session = useAppAndBrowser();

  it('refuses a file with a bad row, naming the row, and changes nothing', async () => {
    const page = await session.pageAs(DEMO.engineer);
    await openDemoBuilding(page);
    const before = await stackVersions(page);
    await page.getByRole('button', { name: 'Import loads' }).click();
    const dialog = page.locator('[data-test="import-dialog"]');
    const csv = [
      'stack,level,Gk_kN,Qk_kN,category',
      'C/4,Level 1,260,130,B',
      'B/2,Level 2,lots,90,B',
      'A/1,Level 3,180,90,B',
    ].join('\n');
    await dialog
      .locator('input[type="file"]')
      .setInputFiles({ name: 'loads.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    // Row 3 of the file (the header is row 1) has text where Gk belongs.
    await dialog
      .getByText(/problem/)
      .first()
      .waitFor({ timeout: 10_000 });
    await dialog.getByText('Row 3', { exact: true }).waitFor();
    await expect(dialog.getByText(/Gk_kN.*not a number/).count()).resolves.toBe(1);
    await expect(dialog.locator('[data-test="import-apply"]').isDisabled()).resolves.toBe(true);
    await screenshot(page, 'import-refused');
    expect(await stackVersions(page)).toEqual(before);
  });
});
