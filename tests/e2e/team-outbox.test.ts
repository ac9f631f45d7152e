import { describe, expect, it } from 'vitest';
import { openVisit, useBrowser } from './support/browser';
import { baseUrl, demoAccount, DEMO_WORKSPACE_NAME } from './support/demo';
import { saveScreenshot } from './support/screenshots';
import { expectNoProblems, signedIn } from './support/session';

const browser = useBrowser();
const invitee = 'kit.fairweather@example.org';

describe('journey: invite a member, who reads the mail in their own Outbox', () => {
  it('sends an invitation as the owner; the invitee finds it in their own Outbox and its link joins them as an editor', async () => {
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

    expectNoProblems(visit);
    await visit.context.close();

    // The Outbox shows only the signed-in account's own mail, so the invitee opens an
    // account under the invited address first and reads the invitation there.
    const newcomer = await openVisit(browser());
    const { page: inviteePage } = newcomer;
    await inviteePage.goto(`${baseUrl}/create-account`);
    const signUp = inviteePage.getByRole('form', { name: 'Create account' });
    await signUp.getByLabel('Name').fill('Kit Fairweather');
    await signUp.getByLabel('E-mail').fill(invitee);
    await signUp.getByLabel('Password').fill('a-long-enough-password');
    await signUp.getByRole('button', { name: 'Create account' }).click();
    await inviteePage.getByRole('button', { name: 'Sign out' }).waitFor();

    await inviteePage.goto(`${baseUrl}/outbox`);
    await inviteePage.getByRole('heading', { name: 'Outbox', exact: true }).waitFor();
    const subject = `${owner.name} invites you to ${DEMO_WORKSPACE_NAME} on Bindery`;
    const caught = inviteePage
      .getByRole('list', { name: 'Caught messages' })
      .getByRole('button')
      .filter({ hasText: subject });
    await caught.first().click();
    await inviteePage.getByRole('heading', { name: subject }).waitFor();
    const link = inviteePage.getByText('Link in this mail').locator('..').getByRole('link');
    const href = (await link.getAttribute('href')) ?? '';
    // The mail links to this server, where the app under test runs.
    expect(href.startsWith(`${baseUrl}/invitations/`)).toBe(true);
    await saveScreenshot(inviteePage, 'journey-08-outbox');

    // Signed in under the invited address, the link joins them to the club.
    await inviteePage.goto(href);
    await inviteePage.getByRole('heading', { name: `Join ${DEMO_WORKSPACE_NAME}`, exact: true }).waitFor();
    await inviteePage.getByText(`${owner.name} invites you to this workspace as an editor.`).waitFor();
    await saveScreenshot(inviteePage, 'journey-08-invitation-page');
    await inviteePage.getByRole('button', { name: `Accept and join ${DEMO_WORKSPACE_NAME}` }).click();
    await inviteePage.getByText('Kit Fairweather', { exact: true }).waitFor();
    // Accepting reloads the session; the switcher then opens the club under the new role.
    await expect
      .poll(() =>
        inviteePage
          .getByRole('combobox', { name: 'Workspace' })
          .evaluate((select: HTMLSelectElement) => select.selectedOptions[0]?.textContent ?? ''),
      )
      .toBe(`${DEMO_WORKSPACE_NAME} (editor)`);
    expectNoProblems(newcomer, [401]);
    await newcomer.context.close();
  });
});
