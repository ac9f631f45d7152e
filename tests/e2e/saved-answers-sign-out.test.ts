import { afterAll, describe, expect, it } from 'vitest';
import { useBrowser, type Visit } from './support/browser';
import { baseUrl, demoAccount } from './support/demo';
import { savedApiAnswers, waitForServiceWorker } from './support/offline';
import { signInThroughForm, signedIn } from './support/session';

// The answers the service worker saves for offline reading belong to the account that
// was signed in: signing out forgets them, so the next account on the same phone never
// reads the last one's data, even offline.

const browser = useBrowser();
const owner = demoAccount('owner');
const viewer = demoAccount('viewer');
let visit: Visit | null = null;

afterAll(async () => {
  await visit?.context.close();
});

describe('saved answers and signing out', () => {
  it('forgets every saved answer on sign-out; the next account offline reads only its own', async () => {
    visit = await signedIn(browser(), owner, 'phone');
    const { page, context } = visit;
    await waitForServiceWorker(page);
    await page.goto(`${baseUrl}/`);
    await page.getByRole('link', { name: 'Kestrel Mk II' }).first().waitFor();

    const before = await savedApiAnswers(page);
    expect(before.some((answer) => answer.url.endsWith('/api/session') && answer.body.includes(owner.email))).toBe(
      true,
    );
    expect(before.some((answer) => /\/api\/workspaces\/[^/]+\/models/.test(answer.url))).toBe(true);

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('heading', { name: 'Sign in', exact: true }).waitFor();
    const after = await savedApiAnswers(page);
    expect(after.filter((answer) => answer.body.includes(owner.email) || answer.body.includes('Kestrel'))).toEqual([]);

    await signInThroughForm(page, viewer);
    await page.getByRole('link', { name: 'Kestrel Mk II' }).first().waitFor();
    await context.setOffline(true);
    const session = await page.evaluate(async () => (await (await fetch('/api/session')).json()) as unknown);
    expect(session).toMatchObject({ data: { user: { email: viewer.email } } });
    const offline = await savedApiAnswers(page);
    expect(offline.filter((answer) => answer.body.includes(owner.email))).toEqual([]);
    await context.setOffline(false);
  });
});
