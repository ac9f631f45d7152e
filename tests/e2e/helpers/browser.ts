import { chromium, type Browser, type Page } from 'playwright-core';

// Debian's Chromium; playwright-core never downloads a browser of its own here.
export const CHROMIUM_PATH = '/usr/bin/chromium';
const FLAGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'];

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: CHROMIUM_PATH, args: FLAGS });
}

/**
 * A fresh page that records what the browser complained about: uncaught errors,
 * console errors, and Content-Security-Policy violations.
 */
export async function openPage(browser: Browser): Promise<{ page: Page; problems: string[] }> {
  const context = await browser.newContext({ viewport: { width: 1024, height: 768 } });
  const page = await context.newPage();
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  page.on('console', (message) => {
    if (message.type() === 'error') problems.push(`console error: ${message.text()}`);
  });
  await page.exposeFunction('__reportCspViolation', (text: string) => problems.push(`CSP: ${text}`));
  await page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (event) => {
      (window as unknown as { __reportCspViolation(text: string): void }).__reportCspViolation(`${event.violatedDirective} blocked ${event.blockedURI}`);
    });
  });
  return { page, problems };
}
