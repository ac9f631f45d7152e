import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiAs, demoModel, demoWorkspaceId } from './support/api';
import { useBrowser, type Visit } from './support/browser';
import { baseUrl, demoAccount } from './support/demo';
import { goOffline, waitForServiceWorker } from './support/offline';
import { saveScreenshot } from './support/screenshots';
import { signedIn } from './support/session';

// No signal at the field: the screens a pilot opened online (the hangar, a model's
// Overview and Field sheet, a unit on the shelf) read the same with the network gone,
// under a banner saying when they were saved; a change attempted offline says it needs
// the network and keeps what was typed.

const browser = useBrowser();
const ids = { workspace: '', kestrel: '', pipit: '' };
let visit: Visit;
let keeper: Visit | null = null;
let signal: { online(): Promise<void> } | null = null;

beforeAll(async () => {
  const api = await apiAs(demoAccount('owner'));
  ids.workspace = await demoWorkspaceId(api);
  ids.kestrel = (await demoModel(api, 'Kestrel Mk II')).id;
  const shelf = await api.get<{ id: string; label: string }[]>(`/workspaces/${ids.workspace}/receivers`);
  ids.pipit = shelf.find((unit) => unit.label === 'Pipit trainer unit')!.id;
});

afterAll(async () => {
  await visit?.context.close();
  await keeper?.context.close();
});

describe('offline at the field', () => {
  it('reads the hangar, the Overview, the Field sheet and a unit offline after opening them online', async () => {
    visit = await signedIn(browser(), demoAccount('owner'), 'phone');
    const { page } = visit;
    await waitForServiceWorker(page);

    await page.goto(`${baseUrl}/w/${ids.workspace}/hangar`);
    await page.getByRole('link', { name: 'Kestrel Mk II' }).first().waitFor();
    await page.goto(`${baseUrl}/models/${ids.kestrel}/overview`);
    await page.getByRole('heading', { name: 'Findings of revision 12' }).waitFor();
    await page.getByRole('link', { name: 'Field sheet' }).click();
    await page.getByText('Revision 12, the latest.').waitFor();
    await page.goto(`${baseUrl}/w/${ids.workspace}/shelf/${ids.pipit}`);
    await page.getByRole('heading', { name: 'Settings it holds' }).waitFor();
    expect(await page.getByText('No signal.').count()).toBe(0);
    await page.goto(`${baseUrl}/models/${ids.kestrel}/overview`);
    await page.getByRole('heading', { name: 'Findings of revision 12' }).waitFor();

    // The signal goes while the app is open, then the pilot taps back to the hangar: it
    // reads from the copy saved earlier rather than waiting for a network.
    signal = await goOffline(page);
    const banner = page.getByRole('status').filter({ hasText: 'No signal.' });
    await page
      .getByRole('link', { name: /hangar$/ })
      .first()
      .click();
    await page.getByRole('link', { name: 'Kestrel Mk II' }).first().waitFor();
    await banner.waitFor();

    await page.goto(`${baseUrl}/models/${ids.kestrel}/overview`);
    await page.getByRole('heading', { name: 'Findings of revision 12' }).waitFor();
    await banner.waitFor();
    expect(await banner.innerText()).toMatch(/what this device saved on \d{1,2} \w+ (at )?\d{2}:\d{2}/);
    await saveScreenshot(page, 'offline-overview-phone');

    await page.reload();
    await page.getByRole('heading', { name: 'Findings of revision 12' }).waitFor();
    await page.getByRole('link', { name: 'Field sheet' }).click();
    await page.getByText('Revision 12, the latest.').waitFor();
    await banner.waitFor();
    await saveScreenshot(page, 'offline-field-sheet-phone');

    await page.goto(`${baseUrl}/w/${ids.workspace}/hangar`);
    await page.getByRole('link', { name: 'Kestrel Mk II' }).first().waitFor();
  });

  it('says a change needs the network, and keeps what was typed', async () => {
    const { page } = visit;
    await page.goto(`${baseUrl}/w/${ids.workspace}/shelf/${ids.pipit}`);
    await page.getByRole('heading', { name: 'Settings it holds' }).waitFor();
    await page.getByRole('button', { name: 'Edit details' }).click();
    const notes = page.getByLabel('Notes');
    const typed = 'Checked at the field: new tape on the case, failsafe to be set at the bench.';
    await notes.fill(typed);
    await page.getByRole('button', { name: 'Save the record' }).click();
    await page.getByText('This needs the network, and this device is offline.').waitFor();
    expect(await notes.inputValue()).toBe(typed);
    await saveScreenshot(page, 'offline-write-phone');

    await signal!.online();
    await page.getByRole('button', { name: 'Save the record' }).click();
    await page.getByRole('dialog').waitFor({ state: 'detached' });
    await page.getByText(typed).first().waitFor();
    // Back online, the banner goes and the answers are the server's again.
    expect(await page.getByText('No signal.').count()).toBe(0);
    const api = await apiAs(demoAccount('owner'));
    expect((await api.get<{ notes: string }>(`/receivers/${ids.pipit}`)).notes).toBe(typed);
    // Chromium logs each request the offline device could not send; nothing else may show.
    expect(visit.problems.unexpected().filter((line) => !line.includes('ERR_INTERNET_DISCONNECTED'))).toEqual([]);
  });

  it('keeps a model’s newest approved revision for the field without its Overview or Field sheet being opened', async () => {
    const api = await apiAs(demoAccount('owner'));
    const sedge = await demoModel(api, 'Sedge 3.4');
    const reviews = await api.get<{ state: string; revision: { number: number } }[]>(`/models/${sedge.id}/reviews`);
    const approved = Math.max(...reviews.filter((r) => r.state === 'approved').map((r) => r.revision.number));
    // The demo's Sedge was approved and then changed: the revision to fly is not the latest.
    expect(approved).toBeLessThan(sedge.latest!.number);

    keeper = await signedIn(browser(), demoAccount('owner'), 'phone');
    const { page } = keeper;
    await waitForServiceWorker(page);
    await page.goto(`${baseUrl}/models/${sedge.id}/history`);
    await page.getByRole('button', { name: 'Keep for the field' }).click();
    await page.getByText(`Kept for the field on this device: revision ${approved}, saved`).waitFor();

    const away = await goOffline(page);
    await page.reload();
    await page.getByRole('link', { name: 'Its field sheet' }).click();
    await page.locator('.field-sheet').waitFor();
    const sheet = (await page.locator('.field-sheet').innerText()).replace(/\s+/g, ' ');
    expect(sheet).toContain(`Revision ${approved} Content fingerprint`);
    expect(sheet).toContain('Review Approved');
    await page.getByRole('link', { name: 'Overview' }).click();
    await page.getByRole('heading', { name: `Findings of revision ${sedge.latest!.number}` }).waitFor();
    await away.online();
  });
});
