import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { bundleOf } from '../../scripts/lib/fake-git-history';
import { fixtureText } from './support/api';
import { useBrowser } from './support/browser';
import { demoAccount } from './support/demo';
import { saveScreenshot } from './support/screenshots';
import { expectNoProblems, signedIn } from './support/session';

const browser = useBrowser();

describe('journey: back up the workspace and import a kept history', () => {
  it('downloads the workspace as a git bundle, then imports a history and opens the model it made', async () => {
    // A history a club member kept by hand: three saves of a glider layout under a name of its own.
    const glider = fixtureText('valid/glider-six-wing-servos.yaml').replace(/^ {2}name: .*$/m, '  name: Whimbrel 3.2');
    const folder = mkdtempSync(path.join(os.tmpdir(), 'bindery-e2e-backups-'));
    const file = path.join(folder, 'whimbrel.bundle');
    writeFileSync(
      file,
      bundleOf(
        ['First layout', 'Flaps on their own channel', 'Longer throws on the ailerons'].map((message, i) => ({
          message,
          when: 1_760_000_000 + i * 86_400,
          files: { 'setup.yaml': glider.replace('Whimbrel 3.2', `Whimbrel 3.2${i === 0 ? '' : ` v${i + 1}`}`) },
        })),
      ),
    );

    const visit = await signedIn(browser(), demoAccount('editor'));
    const { page } = visit;
    await page.getByRole('link', { name: 'Backups', exact: true }).click();
    await page.getByRole('heading', { name: 'Backups', exact: true }).waitFor();
    await page.getByText('A backup file you can open with git: one commit per revision').waitFor();

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('link', { name: 'Download workspace backup' }).click(),
    ]);
    expect(download.suggestedFilename()).toMatch(/-workspace\.bundle$/);
    expect(
      readFileSync(await download.path())
        .subarray(0, 16)
        .toString('latin1'),
    ).toMatch(/^# v[23] git bundle\n/);

    const form = page.getByRole('form', { name: 'Import history' });
    await form.getByLabel('Backup file (.bundle)').setInputFiles(file);
    await form.getByRole('button', { name: 'Import' }).click();
    await page.getByText('Imported 1 model with 3 revisions from whimbrel.bundle.').waitFor();
    await saveScreenshot(page, 'journey-11-backups-import');

    await page.getByRole('list', { name: 'Imported models' }).getByRole('link', { name: 'Whimbrel 3.2 v3' }).click();
    await page.waitForURL(/\/models\/[0-9a-f-]{36}\/overview$/);
    await page.getByRole('heading', { name: 'Overview', exact: true }).waitFor();
    expectNoProblems(visit);
    await visit.context.close();
  });
});
