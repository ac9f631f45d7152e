import { gzipSync } from 'node:zlib';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { openVisit, useBrowser } from './support/browser';
import { baseUrl, demoAccount } from './support/demo';
import { signInThroughForm } from './support/session';

const browser = useBrowser();
// docs/design.md, performance budgets: the first page's JavaScript under 250 KB gzipped.
const BUDGET = 250 * 1024;

/** Every script the page fetched from here on, gzipped as a server would send it. */
function countScripts(page: Page): { files: Map<string, number>; total(): number } {
  const files = new Map<string, number>();
  page.on('response', async (response) => {
    if (response.request().resourceType() !== 'script') return;
    const body = await response.body().catch(() => null);
    if (body) files.set(new URL(response.url()).pathname, gzipSync(body).length);
  });
  return { files, total: () => [...files.values()].reduce((sum, size) => sum + size, 0) };
}

describe('weight of the first page', () => {
  it('loads the sign-in page and then the hangar with under 250 KB of gzipped JavaScript, the editor left out', async () => {
    const visit = await openVisit(browser());
    const scripts = countScripts(visit.page);
    await visit.page.goto(`${baseUrl}/sign-in`);
    await visit.page.getByRole('button', { name: 'Sign in' }).waitFor();
    await visit.page.waitForLoadState('networkidle');
    const signInPage = scripts.total();

    await signInThroughForm(visit.page, demoAccount('viewer'));
    await visit.page.getByRole('link', { name: 'Kestrel Mk II' }).waitFor();
    await visit.page.waitForLoadState('networkidle');
    const withHangar = scripts.total();
    console.log(
      `[e2e] gzipped JavaScript: sign-in page ${(signInPage / 1024).toFixed(1)} KB, with the hangar ${(withHangar / 1024).toFixed(1)} KB, in ${scripts.files.size} files`,
    );

    expect(signInPage).toBeLessThan(BUDGET);
    expect(withHangar).toBeLessThan(BUDGET);
    // CodeMirror arrives with the Edit screen only.
    expect([...scripts.files.keys()].some((file) => /codemirror|yaml-code-editor/i.test(file))).toBe(false);
    await visit.context.close();
  });
});
