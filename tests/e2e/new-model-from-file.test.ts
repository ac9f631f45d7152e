import { mkdtempSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { fixtureText } from './support/api';
import { useBrowser } from './support/browser';
import { demoAccount } from './support/demo';
import { saveScreenshot } from './support/screenshots';
import { expectNoProblems, signedIn } from './support/session';

const browser = useBrowser();

describe('journey: a new model from an uploaded file', () => {
  it('uploads a .yaml from the Hangar, names the model after the file, and opens its revision 1', async () => {
    // A club mate's glider layout saved on the pilot's computer, under a name of its own.
    const text = fixtureText('valid/glider-six-wing-servos.yaml').replace(/^ {2}name: .*$/m, '  name: Curlew 2.9');
    expect(text).toContain('name: Curlew 2.9');
    const folder = mkdtempSync(path.join(os.tmpdir(), 'bindery-e2e-upload-'));
    const file = path.join(folder, 'curlew.yaml');
    writeFileSync(file, text);

    const visit = await signedIn(browser(), demoAccount('editor'));
    const { page } = visit;
    await page.getByRole('heading', { name: 'Hangar', exact: true }).waitFor();
    await page.getByRole('button', { name: 'New model' }).click();
    const dialog = page.getByRole('dialog', { name: 'New model' });
    await dialog.getByText('From a file').click();
    await dialog.getByLabel('Setup file').setInputFiles(file);
    await saveScreenshot(page, 'journey-02-new-model-dialog');
    await dialog.getByRole('button', { name: 'Upload and create' }).click();

    await page.waitForURL(/\/models\/[0-9a-f-]{36}\/overview$/);
    await page.getByRole('region', { name: 'Notifications' }).getByText('Curlew 2.9 is in the hangar').waitFor();
    await page.getByText('Revision 1 is curlew.yaml.').waitFor();
    await page.getByRole('heading', { name: 'Overview', exact: true }).waitFor();
    await page.getByRole('navigation', { name: 'Breadcrumb' }).getByText('Curlew 2.9').waitFor();
    await page.getByText('Revision 1 by Tomas Quillfeather').waitFor();
    await saveScreenshot(page, 'journey-02-new-model-overview');

    await page.getByRole('navigation', { name: 'Breadcrumb' }).getByRole('link').click();
    await page.getByRole('link', { name: 'Curlew 2.9' }).waitFor();
    expectNoProblems(visit);
    await visit.context.close();
  });
});
