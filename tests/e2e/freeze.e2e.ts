// The lead freezes a revision, downloads its calculation package, and every member's
// e-mail with the package attached is in the outbox of the local SMTP fake.
import { readFileSync } from 'node:fs';
import { expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import type { AuthResponse } from '../../shared/schema/api.ts';
import type { OutboxMessage } from '../../shared/schema/outbox.ts';
import { DEMO, DEMO_PASSWORD, describeInBrowser, openDemoBuilding, screenshot, useAppAndBrowser } from './harness.ts';

describeInBrowser('freezing a revision', () => {
  const session = useAppAndBrowser();

  it('the lead freezes P01, downloads its PDF, and the outbox holds the e-mail to every member', async () => {
    const page = await session.pageAs(DEMO.lead);
    await openDemoBuilding(page);
    await page.getByRole('link', { name: 'Revisions' }).click();
    await page.getByRole('button', { name: 'Freeze a revision' }).click();
    const dialog = page.locator('.q-dialog');
    await dialog.getByLabel('Note to the team').fill('Column design for the tender set');
    await screenshot(page, 'freeze-dialog');
    await dialog.getByRole('button', { name: /^Freeze .* revision$/ }).click();
    const row = page.getByRole('region', { name: 'Frozen revisions' }).locator('tbody tr').filter({ hasText: 'P01' });
    await row.waitFor({ timeout: 30_000 });
    await screenshot(page, 'revisions-page');

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      row.getByRole('button', { name: /Download the package of P01/ }).click(),
    ]);
    const pdf = readFileSync(await download.path());
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const parser = new PDFParse({ data: new Uint8Array(pdf) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    expect(text).toContain('P01');
    for (const stack of ['A/1', 'B/2', 'C/4']) expect(text).toContain(stack);
    expect(text).toMatch(/EN 1993-1-1/);
    expect(text).toMatch(/design aid/i);

    const admin = (await (
      await fetch(`${session.app.url}/api/auth/login`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ email: DEMO.admin, password: DEMO_PASSWORD }),
      })
    ).json()) as AuthResponse;
    // The e-mails leave the durable outbox after the freeze has answered: wait for the three (up to 20 s).
    const sent = async () =>
      (
        (await (
          await fetch(`${session.app.url}/api/dev/outbox`, { headers: { Authorization: `Bearer ${admin.token}` } })
        ).json()) as OutboxMessage[]
      ).filter((m) => m.subject.includes('P01'));
    let issued = await sent();
    for (let i = 0; i < 100 && issued.length < 3; i++) {
      await new Promise((resolve) => setTimeout(resolve, 200));
      issued = await sent();
    }
    expect(issued.map((m) => m.to).sort()).toEqual([DEMO.engineer, DEMO.lead, DEMO.viewer].sort());
    for (const m of issued)
      expect(m.attachments.some((a) => a.contentType === 'application/pdf' && a.size > 10_000)).toBe(true);
  });
});
