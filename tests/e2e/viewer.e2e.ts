// A viewer sees the building, its stacks, results and revisions, and can change
// nothing — the screens offer no edits, and the server refuses the ones a viewer tries anyway.
import { expect, it } from 'vitest';
import {
  DEMO,
  describeInBrowser,
  liftRow,
  openDemoBuilding,
  openStack,
  properties,
  results,
  screenshot,
  selectNode,
  useAppAndBrowser,
} from './harness.ts';

describeInBrowser('a viewer', () => {
  const session = useAppAndBrowser();

  it('sees everything and can change nothing', async () => {
    const page = await session.pageAs(DEMO.viewer);
    await openDemoBuilding(page);
    for (const ref of ['A/1', 'B/2', 'C/4']) await page.getByRole('cell', { name: ref, exact: true }).waitFor();
    await expect(page.getByRole('button', { name: 'New stack' }).count()).resolves.toBe(0);
    await expect(page.getByRole('button', { name: 'Add', exact: true }).count()).resolves.toBe(0);
    await screenshot(page, 'viewer-building');

    await openStack(page, 'C/4');
    await page.getByText('read only').first().waitFor();
    await expect(page.locator('.vue-flow__node').count()).resolves.toBeGreaterThan(5);
    await expect(
      results(page)
        .getByText(/design aid/)
        .count(),
    ).resolves.toBeGreaterThan(0);
    // The working of a lift is open to a viewer.
    await liftRow(page, 'L3').click();
    await page
      .getByText(/EN 1993-1-1/)
      .first()
      .waitFor();
    // Forms are read-only and nothing offers to delete.
    await selectNode(page, 'restraint-1');
    const gk = properties(page).getByLabel('Permanent load Gk (kN)');
    await expect(gk.isEditable()).resolves.toBe(false);
    await expect(page.getByRole('button', { name: /delete/i }).count()).resolves.toBe(0);
    await page.keyboard.press('Delete');
    await screenshot(page, 'viewer-stack');

    // The server is the judge: the viewer's own token cannot write, and the stack is unchanged.
    const outcome = await page.evaluate(async () => {
      const token = localStorage.getItem('stanchion.token');
      const headers = { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' };
      const id = location.pathname.split('/').pop();
      const before = await (await fetch(`/api/stacks/${id}`, { headers })).json();
      const put = await fetch(`/api/stacks/${id}`, {
        method: 'PUT',
        headers,
        body: JSON.stringify({ doc: before.doc, baseVersion: before.version }),
      });
      const ops = await fetch(`/api/stacks/${id}/ops`, {
        method: 'POST',
        headers,
        body: JSON.stringify({ baseVersion: before.version, ops: [{ op: 'removeNode', id: 'restraint-1' }] }),
      });
      const after = await (await fetch(`/api/stacks/${id}`, { headers })).json();
      return { put: put.status, ops: ops.status, versionBefore: before.version, versionAfter: after.version };
    });
    expect(outcome).toMatchObject({ put: 403, ops: 403 });
    expect(outcome.versionAfter).toBe(outcome.versionBefore);

    await page.goto(`${session.app.url}/buildings/1/revisions`);
    await page.waitForLoadState('networkidle');
    await expect(page.getByRole('button', { name: /freeze/i }).count()).resolves.toBe(0);
    await screenshot(page, 'viewer-revisions');
  });
});
