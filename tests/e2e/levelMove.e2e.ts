// Moving a level in a real browser: the engineer sees which stacks follow before saving, then the stacks
// follow it with no errors (their floors on the level and the splices above it move with it), drawn at the
// level in the graph.
import { expect, it } from 'vitest';
import {
  DEMO,
  describeInBrowser,
  openDemoBuilding,
  openStack,
  results,
  screenshot,
  useAppAndBrowser,
} from './harness.ts';

describeInBrowser('moving a level', () => {
  const session = useAppAndBrowser();

  it('shows the stacks a level move changes, then moves them with it, with no errors', async () => {
    const page = await session.pageAs(DEMO.engineer);
    await openDemoBuilding(page);
    await page.getByRole('button', { name: 'Change Level 2' }).click();
    const row = page
      .locator('[data-test="level-row"]')
      .filter({ has: page.locator('input[data-test="level-elevation"]') });
    await row.locator('input[data-test="level-elevation"]').fill('7.900');
    await row.getByRole('button', { name: 'Save' }).click();

    const dialog = page.getByRole('dialog');
    await dialog.getByText('Move Level 2 to +7.900 m').waitFor();
    const affected = (await dialog.locator('[data-test="affected-stack"]').allInnerTexts()).map((t) =>
      t.split('\n')[0].trim(),
    );
    expect(affected.sort()).toEqual(['Stack A/1', 'Stack B/2', 'Stack C/4']);
    expect(await dialog.innerText()).toContain('splice');
    await screenshot(page, 'level-move-preview');
    await dialog.getByRole('button', { name: 'Move the level and its stacks' }).click();
    await page.locator('[data-test="levels"]').getByText('+7.900 m').waitFor();

    await openStack(page, 'C/4');
    expect(await results(page).getByText('cannot be checked').count()).toBe(0);
    // The floor tied to the level is drawn at the level, though the move wrote nothing into it
    const titles = page.locator('.vue-flow__node .node-card__title');
    await titles.filter({ hasText: 'Restraint +7.900' }).first().waitFor();
    expect(await titles.filter({ hasText: 'Restraint +7.600' }).count()).toBe(0);
    const takeDown = results(page).locator('[data-test="take-down"]');
    await takeDown.scrollIntoViewIfNeeded();
    expect(await takeDown.locator('tr', { hasText: 'Level 2' }).innerText()).toContain('+7.900');
    await screenshot(page, 'level-move-stack-follows');
    await page.context().close();
  });
});
