import { describe, expect, it } from 'vitest';
import { apiAs, demoModel, type ApiClient } from './support/api';
import { useBrowser } from './support/browser';
import { baseUrl, demoAccount } from './support/demo';
import { saveScreenshot } from './support/screenshots';
import { expectNoProblems, signedIn } from './support/session';

const browser = useBrowser();

/** The ids of the demo Kestrel's revisions by number (api/seed: r5 elevator expo 15 -> 20, r6 low rate 60 -> 65). */
async function revisionIds(api: ApiClient, modelId: string): Promise<Map<number, string>> {
  const list = await api.get<{ id: string; number: number }[]>(`/models/${modelId}/revisions?limit=50`);
  return new Map(list.map((revision) => [revision.number, revision.id]));
}

describe('journey: what now moves differently', () => {
  it('shows the elevator pin and curve for the expo change, and the aileron pins at low rate for the rate change', async () => {
    const reviewer = demoAccount('reviewer');
    const api = await apiAs(reviewer);
    const kestrel = await demoModel(api, 'Kestrel Mk II');
    const ids = await revisionIds(api, kestrel.id);
    const visit = await signedIn(browser(), reviewer);
    const { page } = visit;

    // Revision 5 changed only the elevator expo, 15 -> 20.
    await page.goto(`${baseUrl}/models/${kestrel.id}/compare?from=${ids.get(4)}&to=${ids.get(5)}`);
    const outputs = page.getByRole('region', { name: 'What now moves differently' });
    const table = outputs.getByRole('table', { name: /Receiver pins whose output differs/ });
    await table.waitFor();
    const rows = table.getByRole('row').filter({ has: page.getByRole('cell') });
    expect(await rows.count()).toBeGreaterThan(0);
    for (const row of await rows.all()) {
      const cells = (await row.getByRole('cell').allTextContents()).map((cell) => cell.trim());
      // Fuselage pin 2 carries channel 2, the elevator; the link is up.
      expect(cells.slice(0, 4)).toEqual(['fuselage', '2', '2', 'up']);
    }
    await outputs.getByRole('img', { name: 'Mix elevator to channel 2: before and after' }).waitFor();
    await saveScreenshot(page, 'journey-07-compare-expo');

    // From revision 6 back to 5: only the low aileron rate changes, 65 -> 60.
    await page.goto(`${baseUrl}/models/${kestrel.id}/compare?from=${ids.get(6)}&to=${ids.get(5)}`);
    await outputs
      .getByRole('img', { name: 'Mix ail-left to channel 1, rate-switch at position 1: before and after' })
      .waitFor();
    const rateRows = table.getByRole('row').filter({ has: page.getByRole('cell') });
    const pins = new Set<string>();
    for (const row of await rateRows.all()) {
      const cells = (await row.getByRole('cell').allTextContents()).map((cell) => cell.trim());
      pins.add(cells.slice(0, 3).join(' '));
    }
    // The two aileron channels, 1 and 6, on the fuselage receiver's pins 1 and 6.
    expect([...pins].sort()).toEqual(['fuselage 1 1', 'fuselage 6 6']);
    expect(await table.getByRole('columnheader', { name: /rate-switch at position 1/ }).count()).toBeGreaterThan(0);
    await saveScreenshot(page, 'journey-07-compare-rate');
    expectNoProblems(visit);
    await visit.context.close();
  });
});
