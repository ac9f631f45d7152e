import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';
import { CHROMIUM_PATH } from '../../../scripts/lib/chromium-path';

// Debian's Chromium, headless, with the flags it needs in a container without a GPU or a sandbox
// (DEVELOPERS.md, "Browser tests"); playwright-core never downloads a browser here.
const FLAGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

/** Desktop, the tablet a pilot carries to the field and the phone in the pit area. */
export const VIEWPORTS = {
  desktop: { width: 1280, height: 900 },
  tablet: { width: 768, height: 1024 },
  phone: { width: 375, height: 812 },
} as const;
export type ViewportName = keyof typeof VIEWPORTS;

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: CHROMIUM_PATH, args: FLAGS });
}

/**
 * What the browser complained about on every page of one context: uncaught errors,
 * console errors and Content-Security-Policy violations. A journey that provokes a
 * refused request on purpose (a 409, a 401) names that status in `allowStatuses`;
 * Chromium logs such answers as console errors.
 */
export class Problems {
  readonly all: string[] = [];

  add(problem: string): void {
    this.all.push(problem);
  }

  /** The problems left once the answers a journey asked for are set aside. */
  unexpected(allowStatuses: number[] = []): string[] {
    return this.all.filter(
      (problem) => !allowStatuses.some((status) => problem.includes(`the server responded with a status of ${status}`)),
    );
  }

  get csp(): string[] {
    return this.all.filter((problem) => problem.startsWith('CSP:'));
  }
}

function watch(page: Page, problems: Problems): void {
  page.on('pageerror', (error) => problems.add(`page error: ${error.message}`));
  page.on('console', (message) => {
    if (message.type() === 'error') problems.add(`console error on ${page.url()}: ${message.text()}`);
  });
  page.on('dialog', (dialog) => {
    problems.add(`unexpected ${dialog.type()} dialog: ${dialog.message()}`);
    void dialog.dismiss().catch(() => undefined);
  });
}

export interface Visit {
  context: BrowserContext;
  page: Page;
  problems: Problems;
  /** A further tab in the same session (same cookies), watched the same way. */
  newTab(): Promise<Page>;
}

/** A fresh browser context (its own cookies) with one watched page. */
export async function openVisit(
  browser: Browser,
  viewport: ViewportName = 'desktop',
  { deviceScaleFactor = 1 }: { deviceScaleFactor?: number } = {},
): Promise<Visit> {
  const context = await browser.newContext({
    viewport: VIEWPORTS[viewport],
    deviceScaleFactor,
    acceptDownloads: true,
    locale: 'en-GB',
    timezoneId: 'Europe/London',
  });
  const problems = new Problems();
  await context.exposeBinding('__reportCspViolation', (_source, text: string) => problems.add(`CSP: ${text}`));
  await context.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (event) => {
      const where = event.sourceFile ? ` (${event.sourceFile}:${event.lineNumber})` : '';
      (window as unknown as { __reportCspViolation(text: string): void }).__reportCspViolation(
        `${event.violatedDirective} blocked ${event.blockedURI || 'inline code'} on ${location.pathname}${where}`,
      );
    });
  });
  context.on('page', (page) => watch(page, problems));
  const page = await context.newPage();
  return { context, page, problems, newTab: () => context.newPage() };
}

/** One Chromium for the test file that calls this, opened before its tests and closed after. */
export function useBrowser(): () => Browser {
  let browser: Browser | null = null;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });
  return () => {
    if (!browser) throw new Error('The browser is not open yet: call it inside a test.');
    return browser;
  };
}
