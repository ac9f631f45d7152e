import { describe, expect, it } from 'vitest';
import { apiAs, demoModel } from './support/api';
import { useBrowser } from './support/browser';
import { baseUrl, demoAccount } from './support/demo';
import { saveScreenshot } from './support/screenshots';
import { expectNoProblems, signedIn } from './support/session';

const browser = useBrowser();

describe('journey: compare two revisions from the History', () => {
  it('picks the Kestrel’s revisions 3 and 4 and reads the failsafe fix in the change list and in the outputs delta', async () => {
    const reviewer = demoAccount('reviewer');
    const kestrel = await demoModel(await apiAs(reviewer), 'Kestrel Mk II');
    const visit = await signedIn(browser(), reviewer);
    const { page } = visit;
    await page.goto(`${baseUrl}/models/${kestrel.id}/history`);
    await page.getByRole('heading', { name: 'History', exact: true }).waitFor();

    // Revision 3 remapped the wing receiver; revision 4 fixed its pin 1 failsafe, left at
    // the 988 µs the unit held from its last airframe (the demo seed's story).
    await page.getByLabel('Pick revision 4 to compare').check();
    await page.getByLabel('Pick revision 3 to compare').check();
    await saveScreenshot(page, 'journey-05-history-picked');
    await page.getByRole('button', { name: /^Compare( r3 with r4)?$/ }).click();

    await page.waitForURL(/\/compare\?/);
    await page.getByRole('heading', { name: 'Changes by section', exact: true }).waitFor();
    expect(
      await page
        .getByLabel('Older (from)')
        .evaluate((select: HTMLSelectElement) => select.selectedOptions[0]?.textContent ?? ''),
    ).toMatch(/^r3\b/);
    expect(
      await page
        .getByLabel('Newer (to)')
        .evaluate((select: HTMLSelectElement) => select.selectedOptions[0]?.textContent ?? ''),
    ).toMatch(/^r4\b/);

    const changes = page.getByRole('region', { name: 'Changes by section' });
    const failsafeChange = changes.getByRole('listitem').filter({ hasText: 'receivers[id=wing].map[pin=1].failsafe' });
    await failsafeChange.waitFor();
    const sentence = (await failsafeChange.locator('p').first().textContent()) ?? '';
    expect(sentence).toMatch(/pin 1/i);
    expect(sentence).toContain('988');
    expect(sentence).toContain('1500');
    expect(await changes.getByRole('listitem').count()).toBe(1);

    const outputs = page.getByRole('region', { name: 'What now moves differently' });
    const rows = outputs.getByRole('row').filter({ has: page.getByRole('cell', { name: 'wing', exact: true }) });
    expect(await rows.count()).toBe(1);
    const cells = await rows.first().getByRole('cell').allTextContents();
    // Receiver, pin, channel, link, before, after (the arrow before "after" is drawn, not read out).
    expect(cells.map((cell) => cell.replace(/\s+/g, ' ').replace('->', '').trim())).toEqual([
      'wing',
      '1',
      '9',
      'wing lost',
      '988 µs (failsafe)',
      '1500 µs (failsafe)',
    ]);
    await saveScreenshot(page, 'journey-05-compare');
    expectNoProblems(visit);
    await visit.context.close();
  });
});
