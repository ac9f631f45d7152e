import { describe, expect, it } from 'vitest';
import { apiAs, createModel, fixtureText } from './support/api';
import { useBrowser } from './support/browser';
import { baseUrl, demoAccount } from './support/demo';
import { saveScreenshot } from './support/screenshots';
import { expectNoProblems, signedIn } from './support/session';

const browser = useBrowser();

describe('journey: review and sign-off before the maiden', () => {
  it('has the editor ask for a review, the reviewer work the checklist and approve, and the model show as cleared', async () => {
    const editor = demoAccount('editor');
    const reviewer = demoAccount('reviewer');
    // A model of the editor's own, so the reviewer is not its author and the demo's reviews stay as seeded.
    const { model } = await createModel(
      await apiAs(editor),
      'Dunlin trainer (review journey)',
      fixtureText('valid/trainer-single-receiver.yaml'),
    );

    const asking = await signedIn(browser(), editor);
    await asking.page.goto(`${baseUrl}/models/${model.id}/reviews`);
    await asking.page.getByRole('heading', { name: 'Reviews', exact: true }).waitFor();
    await asking.page.getByText('Nobody has reviewed this model yet.').waitFor();
    await asking.page.getByRole('button', { name: 'Request review' }).click();
    const dialog = asking.page.getByRole('dialog', { name: 'Request a review of revision 1' });
    await dialog.getByLabel(reviewer.name).check();
    await dialog.getByLabel('Note (optional)').fill('First flight on Saturday; please look over the rates.');
    await saveScreenshot(asking.page, 'journey-07-request-review');
    await dialog.getByRole('button', { name: /^Request/ }).click();
    await asking.page.waitForURL(/\/reviews\/[0-9a-f-]{36}$/);
    const reviewUrl = asking.page.url();
    await asking.page.getByText('Note from Tomas Quillfeather:').waitFor();
    // Nobody approves their own revision: the editor's approve choice is closed.
    expect(await asking.page.getByRole('radio', { name: /^Approve/ }).isDisabled()).toBe(true);
    expectNoProblems(asking);

    const reviewing = await signedIn(browser(), reviewer);
    const { page } = reviewing;
    await page.getByRole('navigation', { name: 'Workspace' }).getByRole('link', { name: 'Reviews' }).click();
    await page.getByRole('link', { name: 'Dunlin trainer (review journey), revision 1' }).click();
    expect(page.url()).toBe(reviewUrl);
    const checklist = page.getByRole('complementary', { name: 'Sign-off' });
    await checklist.getByRole('heading', { name: 'Pre-maiden checklist', exact: true }).waitFor();
    const items = checklist.getByRole('checkbox');
    const total = await items.count();
    expect(total).toBeGreaterThan(0);
    for (let index = 0; index < total; index += 1) {
      // The tick is the server's: the box shows it once the answer is back.
      await items.nth(index).click();
      await checklist.getByText(`${index + 1} of ${total} ticked`).waitFor();
    }
    const verdict = page.getByRole('form', { name: 'Give a verdict' });
    await verdict.getByRole('radio', { name: /^Approve/ }).check();
    await verdict
      .getByLabel('What you found')
      .fill('Rates, expo and failsafes as planned; range check done with Tomas.');
    await saveScreenshot(page, 'journey-07-verdict');
    await verdict.getByRole('button', { name: 'Approve' }).click();
    await page
      .getByRole('region', { name: 'Notifications' })
      .getByText('Approved: the requester has been told')
      .waitFor();
    await page.getByText('Cleared for its maiden').waitFor();
    await saveScreenshot(page, 'journey-07-approved');
    expectNoProblems(reviewing);
    await reviewing.context.close();

    await asking.page.goto(`${baseUrl}/models/${model.id}/overview`);
    await asking.page.getByText('Cleared for maiden').waitFor();
    await saveScreenshot(asking.page, 'journey-07-cleared-overview');
    await asking.page.getByRole('navigation', { name: 'Workspace' }).getByRole('link', { name: 'Hangar' }).click();
    const row = asking.page.getByRole('row').filter({ hasText: 'Dunlin trainer (review journey)' });
    await row.getByText('Approved').waitFor();
    expectNoProblems(asking);
    await asking.context.close();
  });
});
