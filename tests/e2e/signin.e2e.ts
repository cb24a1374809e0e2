// The built app, served by the real server, signs in the demo engineer and lists buildings,
// loading nothing from any origin but its own (fonts and icons are served by the app).
import { expect, it } from 'vitest';
import { DEMO, describeInBrowser, newContext, screenshot, signIn, useAppAndBrowser } from './harness.ts';

describeInBrowser('sign-in and the buildings list', () => {
  const session = useAppAndBrowser();

  it('signs in the demo engineer, shows the demo building and requests nothing from other origins', async () => {
    const context = await newContext(session.browser);
    const page = await context.newPage();
    const origins = new Set<string>();
    page.on('request', (req) => origins.add(new URL(req.url()).origin));
    await signIn(page, session.app.url, DEMO.engineer);
    await expect(page.getByText('Demo office block').first().waitFor({ timeout: 10_000 })).resolves.toBeUndefined();
    await page.waitForLoadState('networkidle');
    // Material icons and Roboto must have loaded from the app itself.
    const fontsLoaded = await page.evaluate(async () => {
      await document.fonts.ready;
      return [...document.fonts].filter((f) => f.status === 'loaded').map((f) => f.family);
    });
    expect(fontsLoaded.some((f) => /material icons/i.test(f))).toBe(true);
    await screenshot(page, 'buildings-list');
    expect([...origins].filter((o) => o !== session.app.url && !o.startsWith('data:'))).toEqual([]);
    await context.close();
  });

  it('refuses a wrong password with a message and stays on the sign-in page', async () => {
    const context = await newContext(session.browser);
    const page = await context.newPage();
    await page.goto(`${session.app.url}/sign-in`);
    await page.getByLabel('E-mail').fill(DEMO.engineer);
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page
      .getByText(/e-mail address or password is wrong/i)
      .first()
      .waitFor({ timeout: 10_000 });
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await context.close();
  });
});
