import { describe, expect, it } from 'vitest';
import { useBrowser } from './support/browser';
import { demoAccount } from './support/demo';
import { saveScreenshot } from './support/screenshots';
import { expectNoProblems, signedIn } from './support/session';

const browser = useBrowser();
const payload = '<img src=x onerror=alert(1)>';

describe('journey: markup in what pilots type is shown as text', () => {
  it('creates a model named like an HTML tag and shows the name literally, with no element made and no dialog', async () => {
    const visit = await signedIn(browser(), demoAccount('editor'));
    const { page } = visit;
    let dialogs = 0;
    page.on('dialog', () => (dialogs += 1));

    await page.getByRole('button', { name: 'New model' }).click();
    const dialog = page.getByRole('dialog', { name: 'New model' });
    await dialog.getByLabel('Name').fill(payload);
    await dialog.getByRole('button', { name: 'Create model' }).click();
    await page.waitForURL(/\/overview$/);
    await page.getByRole('navigation', { name: 'Breadcrumb' }).getByText(payload, { exact: true }).waitFor();
    // The screen names the tab once its own data has loaded, a moment after the frame.
    await expect.poll(() => page.title(), { timeout: 10_000 }).toContain(payload);

    await page.getByRole('navigation', { name: 'Breadcrumb' }).getByRole('link').click();
    await page.getByRole('link', { name: payload, exact: true }).waitFor();
    await saveScreenshot(page, 'journey-11-markup-as-text');
    expect(await page.locator('img[src="x"]').count()).toBe(0);
    expect(
      await page.evaluate(() => [...document.images].filter((image) => image.getAttribute('src') === 'x').length),
    ).toBe(0);
    expect(dialogs).toBe(0);
    expectNoProblems(visit);
    await visit.context.close();
  });
});
