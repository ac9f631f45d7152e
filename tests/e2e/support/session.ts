import type { Browser, Page } from 'playwright-core';
import { expect } from 'vitest';
import { openVisit, type ViewportName, type Visit } from './browser';
import { baseUrl, DEMO_PASSWORD, type DemoAccount } from './demo';

/** Fills in the sign-in form as a pilot would and waits for the workspace to open. */
export async function signInThroughForm(page: Page, account: DemoAccount): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(account.email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('button', { name: 'Sign out' }).waitFor();
}

/** A fresh context signed in as a demo account, on the page the sign-in lands on. */
export async function signedIn(
  browser: Browser,
  account: DemoAccount,
  viewport: ViewportName = 'desktop',
): Promise<Visit> {
  const visit = await openVisit(browser, viewport);
  await signInThroughForm(visit.page, account);
  return visit;
}

/** No console errors, no page errors, no CSP violations (statuses a journey provoked on purpose aside). */
export function expectNoProblems(visit: Visit, allowStatuses: number[] = []): void {
  expect(visit.problems.unexpected(allowStatuses)).toEqual([]);
}
