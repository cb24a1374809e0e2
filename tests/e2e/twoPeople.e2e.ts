// Two people on the same stack in two browser contexts. An edit in one appears,
// with its new results, in the other within 2 s, and each sees the other present.
import { expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import {
  DEMO,
  describeInBrowser,
  liftRow,
  liftUtilisation,
  openDemoBuilding,
  openStack,
  pickSection,
  screenshot,
  useAppAndBrowser,
} from './harness.ts';

describeInBrowser('two people on one stack', () => {
  const session = useAppAndBrowser();

  async function onStack(email: string): Promise<Page> {
    const page = await session.pageAs(email);
    await openDemoBuilding(page);
    await openStack(page, 'C/4');
    return page;
  }

  it("shows each other's presence, and one person's edit reaches the other with new results within 2 s", async () => {
    const engineer = await onStack(DEMO.engineer);
    const lead = await onStack(DEMO.lead);
    await engineer.locator('[title="Lead Engineer is here"]').waitFor({ timeout: 5000 });
    await lead.locator('[title="Design Engineer is here"]').waitFor({ timeout: 5000 });

    const before = await liftUtilisation(lead, 'L2');
    await liftRow(engineer, 'L2').click();
    // The moment the choice is made in one browser, the clock starts for the other.
    await pickSection(engineer, 'UKC 203x203x46');
    const t0 = Date.now();
    await liftRow(lead, 'L2').filter({ hasText: 'UKC 203x203x46' }).waitFor({ timeout: 2000 });
    await expect
      .poll(() => liftUtilisation(lead, 'L2'), { timeout: 2000 - (Date.now() - t0), interval: 50 })
      .toBeGreaterThan(before);
    expect(Date.now() - t0).toBeLessThan(2000);
    expect(await liftUtilisation(lead, 'L2')).toBe(await liftUtilisation(engineer, 'L2'));
    await screenshot(engineer, 'two-people-engineer');
    await screenshot(lead, 'two-people-lead');
  });
});
