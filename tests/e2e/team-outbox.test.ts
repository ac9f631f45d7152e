import { describe, expect, it } from 'vitest';
import { openVisit, useBrowser } from './support/browser';
import { baseUrl, demoAccount, DEMO_WORKSPACE_NAME } from './support/demo';
import { saveScreenshot } from './support/screenshots';
import { expectNoProblems, signedIn } from './support/session';

const browser = useBrowser();
const invitee = 'kit.fairweather@example.org';

describe('journey: invite a member and read the mail in the Outbox', () => {
  it('sends an invitation as the owner, finds it in the Outbox, and the link lets the invitee join as an editor', async () => {
    const owner = demoAccount('owner');
    const visit = await signedIn(browser(), owner);
    const { page } = visit;
    await page.getByRole('navigation', { name: 'Workspace' }).getByRole('link', { name: 'Team' }).click();
    await page.getByRole('heading', { name: 'Team', exact: true }).waitFor();

    const form = page.getByRole('form', { name: 'Invite a member' });
    await form.getByLabel('E-mail').fill(invitee);
    await form.getByLabel('Role').selectOption('editor');
    await form.getByRole('button', { name: 'Send invitation' }).click();
    await form.getByText(`An invitation is on its way to ${invitee}.`, { exact: false }).waitFor();
    await page.getByRole('list', { name: 'Pending invitations' }).getByText(invitee).waitFor();
    await saveScreenshot(page, 'journey-08-invitation-sent');

    await page.getByRole('navigation', { name: 'Development tools' }).getByRole('link', { name: 'Outbox' }).click();
    await page.getByRole('heading', { name: 'Outbox', exact: true }).waitFor();
    const subject = `${owner.name} invites you to ${DEMO_WORKSPACE_NAME} on Bindery`;
    const caught = page.getByRole('list', { name: 'Caught messages' }).getByRole('button').filter({ hasText: invitee });
    await caught.first().click();
    await page.getByRole('heading', { name: subject }).waitFor();
    const link = page.getByText('Link in this mail').locator('..').getByRole('link');
    const href = (await link.getAttribute('href')) ?? '';
    // The mail links to this server, where the app under test runs.
    expect(href.startsWith(`${baseUrl}/invitations/`)).toBe(true);
    await saveScreenshot(page, 'journey-08-outbox');
    expectNoProblems(visit);
    await visit.context.close();

    // The invitee has no account yet: the link offers one and joins them to the club.
    const newcomer = await openVisit(browser());
    await newcomer.page.goto(href);
    await newcomer.page.getByRole('heading', { name: `Join ${DEMO_WORKSPACE_NAME}`, exact: true }).waitFor();
    await newcomer.page.getByText(`${owner.name} invites you to this workspace as an editor.`).waitFor();
    const join = newcomer.page.getByRole('form', { name: 'Create your account and join' });
    await join.getByLabel('Name').fill('Kit Fairweather');
    await join.getByLabel('Password').fill('a-long-enough-password');
    await saveScreenshot(newcomer.page, 'journey-08-invitation-page');
    await join.getByRole('button', { name: 'Create account and join' }).click();
    await newcomer.page.getByRole('button', { name: 'Sign out' }).waitFor();
    await newcomer.page.getByText('Kit Fairweather', { exact: true }).waitFor();
    const workspace = await newcomer.page
      .getByRole('combobox', { name: 'Workspace' })
      .evaluate((select: HTMLSelectElement) => select.selectedOptions[0]?.textContent ?? '');
    expect(workspace).toBe(`${DEMO_WORKSPACE_NAME} (editor)`);
    expectNoProblems(newcomer, [401]);
    await newcomer.context.close();
  });
});
