// A revision prepared by one engineer, checked with a comment by another member, the comment resolved, approved by
// the lead; the issued package's cover names all three (docs/issue-workflow.md).
import { readFileSync } from 'node:fs';
import { expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import type { Page } from 'playwright-core';
import { DEMO_BUILDING } from '../../seeds/demo.ts';
import type { AuthResponse, Building, Member } from '../../shared/schema/api.ts';
import { DEMO, DEMO_PASSWORD, describeInBrowser, openDemoBuilding, screenshot, useAppAndBrowser } from './harness.ts';

// The demo's names (seeds/demo.ts).
const PREPARER = 'Design Engineer';
const CHECKER = 'Drafting Viewer';
const APPROVER = 'Lead Engineer';

describeInBrowser('checking and approving a revision', () => {
  const session = useAppAndBrowser();

  async function api<T>(token: string, method: string, path: string, body?: unknown): Promise<T> {
    const res = await fetch(`${session.app.url}/api${path}`, {
      method,
      headers: { 'Content-Type': 'application/json', Authorization: `Bearer ${token}` },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
    return (await res.json()) as T;
  }

  const review = (page: Page) => page.locator('[data-test="review"]');
  const row = (page: Page, code: string) =>
    page.getByRole('region', { name: 'Frozen revisions' }).locator('tbody tr').filter({ hasText: code });
  async function openRevision(page: Page, buildingId: number, code: string): Promise<void> {
    await page.goto(`${session.app.url}/buildings/${buildingId}/revisions`);
    await row(page, code).getByRole('button', { name: 'Details' }).click();
    await review(page).locator('[data-test="sign-offs"]').waitFor();
  }

  it('prepare, check with a comment, resolve, approve: the package cover names the three', async () => {
    // The demo's viewer becomes an engineer, so a second member may check what the engineer prepared.
    const lead = (await (
      await fetch(`${session.app.url}/api/auth/login`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ email: DEMO.lead, password: DEMO_PASSWORD }),
      })
    ).json()) as AuthResponse;
    // The building openDemoBuilding opens; the demo has a second one.
    const building = (await api<Building[]>(lead.token, 'GET', '/buildings')).find(
      (b) => b.name === DEMO_BUILDING.name,
    )!;
    const members = await api<Member[]>(lead.token, 'GET', `/buildings/${building.id}/members`);
    const viewer = members.find((m) => m.email === DEMO.viewer);
    await api(lead.token, 'PATCH', `/buildings/${building.id}/members/${viewer?.userId}`, { role: 'engineer' });

    // The engineer prepares C01 for checking: not issued, so no check button for the preparer.
    const engineer = await session.pageAs(DEMO.engineer);
    await openDemoBuilding(engineer);
    await engineer.getByRole('link', { name: 'Revisions' }).click();
    await engineer.getByRole('button', { name: 'Prepare for checking' }).click();
    const dialog = engineer.locator('.q-dialog');
    await dialog.getByText('For construction (C01, C02…)').click();
    await dialog.getByLabel('Note to the team').fill('Column design for checking');
    await dialog.getByRole('button', { name: 'Prepare for construction revision' }).click();
    await row(engineer, 'C01').waitFor({ timeout: 30_000 });
    await review(engineer).getByText('awaiting check by a member who did not prepare it').waitFor();
    expect(await review(engineer).locator('[data-test="check"]').count()).toBe(0);
    expect(await review(engineer).locator('[data-test="approve"]').count()).toBe(0);

    // The checker comments on a stack and records the check.
    const checker = await session.pageAs(DEMO.viewer);
    await openRevision(checker, building.id, 'C01');
    await review(checker).getByLabel('Comment').fill('Base plate of the corner column: show the anchor layout');
    await review(checker).getByRole('button', { name: 'Add comment' }).click();
    await review(checker).locator('[data-test="comment"]').filter({ hasText: 'anchor layout' }).waitFor();
    await review(checker).getByRole('button', { name: 'Record my check' }).click();
    await review(checker).locator('[data-test="sign-off-checked"]').filter({ hasText: CHECKER }).waitFor();
    await screenshot(checker, 'review-checked');

    // With the comment open, the lead's approval needs a reason; the engineer resolves it instead.
    const leadPage = await session.pageAs(DEMO.lead);
    await openRevision(leadPage, building.id, 'C01');
    expect(await review(leadPage).getByRole('button', { name: 'Approve and issue' }).isDisabled()).toBe(true);
    await openRevision(engineer, building.id, 'C01');
    await review(engineer).getByRole('button', { name: 'Resolve' }).click();
    await review(engineer).locator('[data-test="resolved"]').filter({ hasText: PREPARER }).waitFor();

    // The lead's page, left open, follows the resolution live: the approval needs no reason now, without a reload.
    const approve = review(leadPage).getByRole('button', { name: 'Approve and issue' });
    await expect.poll(() => approve.isDisabled(), { timeout: 10_000, interval: 100 }).toBe(false);
    await approve.click();
    await review(leadPage).locator('[data-test="review-state"]').filter({ hasText: 'issued' }).waitFor();
    await review(leadPage).locator('[data-test="sign-off-approved"]').filter({ hasText: APPROVER }).waitFor();
    await screenshot(leadPage, 'review-issued');

    const [download] = await Promise.all([
      leadPage.waitForEvent('download'),
      row(leadPage, 'C01')
        .getByRole('button', { name: /Download the package of C01/ })
        .click(),
    ]);
    const pdf = readFileSync(await download.path());
    const parser = new PDFParse({ data: new Uint8Array(pdf) });
    const cover = (await parser.getText()).pages[0].text.replace(/\s+/g, ' ');
    await parser.destroy();
    expect(cover).toContain(`Prepared by ${PREPARER}`);
    expect(cover).toContain(`Checked by ${CHECKER}`);
    expect(cover).toContain(`Approved by ${APPROVER}`);
    expect(cover).not.toContain('CHECK COPY');
  });
});
