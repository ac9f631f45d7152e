import { describe, expect, it } from 'vitest';
import { openVisit, useBrowser } from './support/browser';
import { baseUrl, demoAccount, DEMO_PASSWORD, DEMO_WORKSPACE_NAME } from './support/demo';
import { saveScreenshot } from './support/screenshots';
import { expectNoProblems, signInThroughForm } from './support/session';

const browser = useBrowser();
const owner = demoAccount('owner');

describe('journey: sign in and out', () => {
  it('opens signed out without a single console error or failed request', async () => {
    const visit = await openVisit(browser());
    await visit.page.goto(`${baseUrl}/`);
    await visit.page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
    await visit.page.goto(`${baseUrl}/w/any/hangar`);
    await visit.page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
    // No allowance at all: not even a 401 from asking who is signed in.
    expect(visit.problems.all).toEqual([]);
    await visit.context.close();
  });

  it('signs the demo owner in to the demo workspace with an httpOnly cookie, and out again', async () => {
    const visit = await openVisit(browser());
    const { page } = visit;
    await page.goto(`${baseUrl}/`);
    // A signed-out visit to the app lands on the sign-in page.
    await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
    await saveScreenshot(page, 'journey-01-sign-in');

    await signInThroughForm(page, owner);
    await page.waitForURL(/\/w\/[0-9a-f-]{36}\/hangar/);
    await page.getByText(owner.name, { exact: true }).waitFor();
    const chosen = await page
      .getByRole('combobox', { name: 'Workspace' })
      .evaluate((select: HTMLSelectElement) => select.selectedOptions[0]?.textContent ?? '');
    expect(chosen).toBe(`${DEMO_WORKSPACE_NAME} (owner)`);
    await page.getByRole('link', { name: 'Kestrel Mk II' }).waitFor();
    const cookies = await visit.context.cookies();
    expect(cookies.find((cookie) => cookie.name === 'bindery_session')).toMatchObject({
      httpOnly: true,
      sameSite: 'Lax',
    });
    expect(await page.evaluate(() => document.cookie)).not.toContain('bindery_session');
    await saveScreenshot(page, 'journey-01-signed-in');

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    expect((await visit.context.cookies()).find((cookie) => cookie.name === 'bindery_session')).toBeUndefined();
    // The hangar is out of reach once signed out: back to sign-in, with the way back kept.
    await page.goto(`${baseUrl}/w/any/hangar`);
    await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
    expect(new URL(page.url()).searchParams.get('next')).toBe('/w/any/hangar');
    await saveScreenshot(page, 'journey-01-signed-out');
    expectNoProblems(visit, []);
    await visit.context.close();
  });

  it('tells a pilot who types the wrong password so, and stays on the sign-in page', async () => {
    const visit = await openVisit(browser());
    const { page } = visit;
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('viewer@demo.example');
    await page.getByLabel('Password').fill(`${DEMO_PASSWORD}-not`);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('The e-mail address or the password is wrong.').waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await saveScreenshot(page, 'journey-01-wrong-password');
    expectNoProblems(visit, [401]);
    await visit.context.close();
  });
});
