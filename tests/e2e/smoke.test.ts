import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_WORKSPACE_NAME } from '../../api/seed/demo-data';
import { launchBrowser, openPage } from './helpers/browser';

const baseUrl = inject('e2eBaseUrl');
const owner = DEMO_ACCOUNTS.find((account) => account.role === 'owner')!;
let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

describe('smoke: the built app in a browser', () => {
  it('shows the sign-in page and signs the demo owner in to the demo workspace', async () => {
    const { page, problems } = await openPage(browser);
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill(owner.email);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();

    await page.waitForURL(/\/w\/[0-9a-f-]{36}/);
    await page.getByText(owner.name, { exact: true }).waitFor({ state: 'visible' });
    const switcher = page.getByRole('combobox', { name: 'Workspace' });
    const chosen = await switcher.evaluate((select: HTMLSelectElement) => select.selectedOptions[0]?.textContent ?? '');
    expect(chosen).toBe(`${DEMO_WORKSPACE_NAME} (owner)`);
    const cookies = await page.context().cookies();
    expect(cookies.find((cookie) => cookie.name === 'bindery_session')).toMatchObject({ httpOnly: true, sameSite: 'Lax' });
    expect(problems).toEqual([]);
  });

  it('tells a pilot who types the wrong password so, and stays on the sign-in page', async () => {
    const { page } = await openPage(browser);
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('viewer@demo.example');
    await page.getByLabel('Password').fill('not-the-demo-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('The e-mail address or the password is wrong.').waitFor({ state: 'visible' });
    expect(new URL(page.url()).pathname).toBe('/sign-in');
  });
});
