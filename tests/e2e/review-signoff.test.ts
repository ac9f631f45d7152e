import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { apiAs, createModel, fixtureText, type ApiClient } from './support/api';
import { seriousA11yViolations } from './support/axe';
import { useBrowser, type ViewportName } from './support/browser';
import { baseUrl, demoAccount } from './support/demo';
import { saveScreenshot } from './support/screenshots';
import { expectNoProblems, signedIn } from './support/session';

// Issue 16, the review half: a reviewer's deliberate sign-off on a complete review page
// with threads on settings, and a pilot seeing which revision is cleared to fly.

const browser = useBrowser();

const SCALE = fixtureText('valid/scale-16-channel-two-receivers.yaml');
// One open warning: the wing receiver's pin 1 loses its failsafe.
const WITH_WARNING = SCALE.replace('{ pin: 1, ch: 9,  failsafe: 1500 }', '{ pin: 1, ch: 9 }');
const failsafe = (value: string) =>
  WITH_WARNING.replace('{ pin: 3, ch: 11, failsafe: hold }', `{ pin: 3, ch: 11, failsafe: ${value} }`);

interface Arranged {
  modelId: string;
  reviewId: string;
  revisions: { id: string; number: number }[];
}

const ALL_ITEMS = [
  'control-directions',
  'throws-measured',
  'failsafe-tested',
  'range-check',
  'range-check-each-receiver',
  'bind-check',
  'arm-switch-stops-motor',
  'centre-of-gravity',
  'battery-charge',
  'receiver-power',
];

/**
 * A model whose revision 1 the demo reviewer approved with the whole checklist ticked,
 * then two saves by the editor (a failsafe changed each time) and an open review of
 * revision 3: "approved r1, latest r3 waiting for review".
 */
async function arrange(name: string): Promise<Arranged> {
  const editor = await apiAs(demoAccount('editor'));
  const reviewer = await apiAs(demoAccount('reviewer'));
  const reviewerId = (await reviewer.get<{ user: { id: string } }>('/me')).user.id;
  const { model, revision } = await createModel(editor, name, WITH_WARNING);
  const first = await editor.post<{ id: string }>(`/revisions/${revision.id}/reviews`, { reviewers: [reviewerId] });
  await reviewer.post(`/reviews/${first.id}/verdicts`, {
    verdict: 'approve',
    body: 'Checked at the field.',
    checklist: Object.fromEntries(ALL_ITEMS.map((item) => [item, true])),
    confirm_left_open: true,
  });
  const two = await editor.post<{ id: string; number: number }>(`/models/${model.id}/revisions`, {
    base: 1,
    yaml: failsafe('1500'),
    message: 'Landing light fails on',
  });
  const three = await editor.post<{ id: string; number: number }>(`/models/${model.id}/revisions`, {
    base: 2,
    yaml: failsafe('1200'),
    message: 'Landing light dims on loss',
  });
  const review = await editor.post<{ id: string }>(`/revisions/${three.id}/reviews`, {
    reviewers: [reviewerId],
    note: 'Maiden on Sunday.',
  });
  return { modelId: model.id, reviewId: review.id, revisions: [revision, two, three] };
}

async function expectAccessible(page: Page): Promise<void> {
  expect(await seriousA11yViolations(page)).toEqual([]);
}

const top = async (page: Page, selector: ReturnType<Page['getByRole']>) => (await selector.boundingBox())!.y;

describe('journey: a reviewer signs off deliberately on the whole setup', () => {
  for (const viewport of ['desktop', 'tablet'] as ViewportName[]) {
    it(`puts the checklist before the verdict, chooses nothing in advance and shows the whole plan (${viewport})`, async () => {
      const { reviewId } = await arrange(`Kestrel sign-off layout (${viewport})`);
      const visit = await signedIn(browser(), demoAccount('reviewer'), viewport);
      const { page } = visit;
      await page.goto(`${baseUrl}/w/_/reviews/${reviewId}`.replace('/w/_/', `/w/${await workspaceOf(page)}/`));
      const signOff = page.getByRole('complementary', { name: 'Sign-off' });
      const checklistHeading = signOff.getByRole('heading', { name: 'Pre-maiden checklist' });
      await checklistHeading.waitFor();
      const verdict = page.getByRole('form', { name: 'Give a verdict' });
      // On screen and in tab order: the checklist first, then the verdict.
      expect(await top(page, checklistHeading)).toBeLessThan(await top(page, verdict.getByRole('radio').first()));
      const order = await page.evaluate(() => {
        const box = document.querySelector('[aria-label="Sign-off"] input[type="checkbox"]');
        const radio = document.querySelector('form[aria-label="Give a verdict"] input[type="radio"]');
        return box && radio ? box.compareDocumentPosition(radio) & Node.DOCUMENT_POSITION_FOLLOWING : 0;
      });
      expect(order).toBeGreaterThan(0);
      expect(await verdict.getByRole('radio', { checked: true }).count()).toBe(0);

      // The whole plan, marked against the last approved revision (1): pin 3 of the wing changed.
      await page.getByRole('heading', { name: 'The whole setup of revision 3' }).waitFor();
      await page.getByText('Each entry is marked against the last approved revision, revision 1.').waitFor();
      const wing = page.getByRole('table', { name: 'Pins of receiver wing' });
      await wing.getByRole('row', { name: /Pin 3/ }).getByText('Changed').waitFor();
      expect(await wing.getByRole('row', { name: /Pin 2/ }).getByText('Same').count()).toBe(1);
      // Ticks whose settings did not change came over from the review of revision 1, saying why.
      await signOff.getByText(/Carried from the review of revision 1: revision 3 leaves the model block/).waitFor();
      await saveScreenshot(page, `review-page-${viewport}`);
      await expectAccessible(page);
      expectNoProblems(visit);
      await visit.context.close();
    });
  }

  it('compares with another revision, threads a comment on a pin and approves with a confirmation, by keyboard', async () => {
    const { reviewId, modelId } = await arrange('Kestrel sign-off journey');
    const visit = await signedIn(browser(), demoAccount('reviewer'));
    const { page } = visit;
    const ws = await workspaceOf(page);
    await page.goto(`${baseUrl}/w/${ws}/reviews/${reviewId}`);
    await page.getByRole('heading', { name: 'The whole setup of revision 3' }).waitFor();

    // The comparison base, chosen on the page.
    const base = page.getByLabel('Compare with');
    await base.focus();
    await base.selectOption('previous');
    await page.waitForURL(/\?base=previous$/);
    await page.getByRole('heading', { name: 'What changed since revision 2' }).waitFor();
    await page.getByText('Each entry is marked against the revision before it, revision 2.').waitFor();
    await base.selectOption('none');
    await page.getByText('Nothing to compare with: every entry is new to the reviewer.').waitFor();
    await base.selectOption('approved');
    await page.getByText('Each entry is marked against the last approved revision, revision 1.').waitFor();

    // A thread started from the pin itself, written and sent with the keyboard.
    await page.getByRole('button', { name: 'Comment on Pin 3 of receiver wing' }).focus();
    await page.keyboard.press('Enter');
    const start = page.getByRole('form', { name: 'Start a comment' });
    const box = start.getByLabel('Comment on Pin 3 of receiver wing');
    expect(await box.evaluate((element) => element === document.activeElement)).toBe(true);
    await page.keyboard.type('Dimmed landing light on loss: is 1200 bright enough to find it?');
    await page.keyboard.press('Tab');
    await page.keyboard.press('Enter');
    const open = page.getByRole('list', { name: 'Open comments' });
    const thread = open.getByRole('listitem', { name: 'Comment on Pin 3 of receiver wing' });
    await thread.getByText('Dimmed landing light on loss').waitFor();
    await page.getByRole('table', { name: 'Pins of receiver wing' }).getByText('(1 open comment)').waitFor();

    const reply = thread.getByRole('textbox', { name: 'Reply on Pin 3 of receiver wing' });
    await reply.focus();
    await page.keyboard.type('Seen from the pits at dusk: fine.');
    await page.keyboard.press('Enter');
    await thread.getByText('Seen from the pits at dusk: fine.').waitFor();
    await thread.getByRole('button', { name: 'Resolve' }).focus();
    await page.keyboard.press('Enter');
    await page.getByText('No open comments.').waitFor();
    await page.getByRole('button', { name: 'Show 1 resolved' }).click();
    const resolved = page.getByRole('list', { name: 'Resolved comments' });
    await resolved.getByText(/Resolved by Ines/).waitFor();
    await resolved.getByRole('button', { name: 'Reopen' }).focus();
    await page.keyboard.press('Enter');
    await open.getByText('Dimmed landing light on loss').waitFor();

    // Approving with items unticked and a warning open asks first, and the approval says what was left.
    const verdict = page.getByRole('form', { name: 'Give a verdict' });
    await verdict.getByRole('radio', { name: /^Approve/ }).focus();
    await page.keyboard.press('Space');
    await page.keyboard.press('Tab');
    await page.keyboard.type('Rates and throws as before; the landing light is the only change.');
    await page.keyboard.press('Tab');
    await page.keyboard.press('Enter');
    const dialog = page.getByRole('dialog', { name: 'Approve with these left open?' });
    await dialog.getByText('Battery charge').waitFor();
    await dialog.getByText(/Pin 1 of receiver wing \(channel 9\) has no failsafe/).waitFor();
    await saveScreenshot(page, 'review-confirm-approval', { fullPage: false });
    await expectAccessible(page);
    // "Go back" has the focus; the next Tab reaches the approval.
    await page.keyboard.press('Tab');
    await page.keyboard.press('Enter');
    await page
      .getByRole('region', { name: 'Notifications' })
      .getByText('Approved: the requester has been told')
      .waitFor();
    const given = page.getByRole('list', { name: 'Verdicts given' });
    await given.getByText('Approved with these left open:').waitFor();
    await given.getByText('Not ticked: Failsafe tested').waitFor();
    await page.getByText('Cleared for its maiden').waitFor();
    await saveScreenshot(page, 'review-approved-with-left-open');
    await expectAccessible(page);
    expectNoProblems(visit);
    await visit.context.close();

    // The open thread sits beside its line in the editor.
    const pilot = await signedIn(browser(), demoAccount('editor'));
    await pilot.page.goto(`${baseUrl}/models/${modelId}/edit`);
    const notes = pilot.page.getByRole('complementary', { name: 'Checks' });
    await notes.getByText('Open comments (1)').waitFor();
    // The editor draws the lines in view: the thread's line link brings its mark into view.
    await notes.getByRole('link', { name: /^line \d+$/ }).click();
    await pilot.page.locator('.cm-comment-mark').first().waitFor();
    expect(await pilot.page.locator('.cm-comment-mark').first().getAttribute('title')).toContain(
      'Dimmed landing light on loss',
    );
    await saveScreenshot(pilot.page, 'editor-open-comment', { fullPage: false });
    expectNoProblems(pilot);
    await pilot.context.close();
  });
});

describe('journey: a pilot sees which revision is cleared to fly', () => {
  for (const viewport of ['desktop', 'tablet'] as ViewportName[]) {
    it(`reads "approved r1, latest r3" and opens revision 1's Overview, Bench and Field sheet (${viewport})`, async () => {
      const name = `Kestrel cleared (${viewport})`;
      const { modelId, revisions } = await arrange(name);
      const visit = await signedIn(browser(), demoAccount('editor'), viewport);
      const { page } = visit;
      await page.goto(`${baseUrl}/w/${await workspaceOf(page)}/hangar`);
      const row = page.getByRole('row').filter({ hasText: name });
      await row.getByText('Approved r1, latest r3 waiting for review').waitFor();
      await expectAccessible(page);

      // History rows open their revision; the approved one is marked.
      await page.goto(`${baseUrl}/models/${modelId}/history`);
      const first = page.getByRole('article', { name: /^r1/ });
      await first.getByText('Approved, cleared to fly').waitFor();
      await first.getByRole('link', { name: 'r1', exact: true }).click();
      await page.waitForURL(/\/overview\?revision=1$/);
      await page.getByText('This is revision 1; the latest is revision 3.').waitFor();
      await page.getByText('Approved, cleared to fly').waitFor();
      await saveScreenshot(page, `overview-revision-1-${viewport}`);
      await expectAccessible(page);

      await page.goto(`${baseUrl}/models/${modelId}/bench?revision=1`);
      expect(await page.getByLabel('Revision').inputValue()).toBe(revisions[0].id);
      await page.getByRole('link', { name: 'Field sheet', exact: true }).click();
      await page.goto(`${baseUrl}/models/${modelId}/sheet?revision=1`);
      await page.getByText('Revision 1', { exact: false }).first().waitFor();
      const pdf = page.getByRole('link', { name: /PDF/ });
      expect(await pdf.getAttribute('href')).toBe(`/api/revisions/${revisions[0].id}/field-sheet.pdf`);
      await expectAccessible(page);

      // The Reviews tab agrees with the reviews it lists.
      await page.goto(`${baseUrl}/models/${modelId}/reviews`);
      await page.getByText('A review of revision 3, the latest, is waiting for a verdict.').waitFor();
      await page.getByText(/Cleared to fly: revision 1, approved by Ines/).waitFor();
      expect(await page.getByText('Nobody has reviewed this model yet.').count()).toBe(0);
      await expectAccessible(page);
      expectNoProblems(visit);
      await visit.context.close();
    });
  }

  it('warns in the save dialog that the approval goes stale and names who must look again', async () => {
    const editor = await apiAs(demoAccount('editor'));
    const { modelId } = await approvedModel(editor, 'Kestrel save warning');
    const visit = await signedIn(browser(), demoAccount('editor'));
    const { page } = visit;
    await page.goto(`${baseUrl}/models/${modelId}/edit`);
    const text = page.locator('.cm-content[contenteditable="true"]');
    await text.waitFor();
    await text.click();
    await page.keyboard.press('Control+End');
    await page.keyboard.type('\n# a note only\n');
    await page.getByRole('button', { name: 'Save revision…' }).click();
    const dialog = page.getByRole('dialog', { name: 'Save as revision 2' });
    await dialog.getByText(/Only comments or layout change, so the approval of revision 1 still holds/).waitFor();
    await page.keyboard.press('Escape');

    // Then a setting: the dialog says the approval goes stale and whose it was.
    await text.click();
    await page.keyboard.press('Control+End');
    await page.keyboard.type('\naccepted: []\n');
    await page.getByRole('button', { name: 'Save revision…' }).click();
    await dialog
      .getByText(
        /Revision 1 is approved by Ines \S+\. This save changes settings, so that approval goes stale: Ines \S+ or another reviewer must look at revision 2/,
      )
      .waitFor();
    await saveScreenshot(page, 'save-dialog-stale-approval', { fullPage: false });
    await expectAccessible(page);
    await page.keyboard.press('Escape');
    expectNoProblems(visit);
    await visit.context.close();
  });

  it('says the latest revision is not reviewed when only an earlier one had changes asked for', async () => {
    const editor = await apiAs(demoAccount('editor'));
    const reviewer = await apiAs(demoAccount('reviewer'));
    const reviewerId = (await reviewer.get<{ user: { id: string } }>('/me')).user.id;
    const { model, revision } = await createModel(editor, 'Kestrel changes asked', SCALE);
    const review = await editor.post<{ id: string }>(`/revisions/${revision.id}/reviews`, { reviewers: [reviewerId] });
    await reviewer.post(`/reviews/${review.id}/verdicts`, { verdict: 'request-changes', body: 'Measure the throws.' });
    await editor.post(`/models/${model.id}/revisions`, { base: 1, yaml: failsafe('1500'), message: 'Throws measured' });
    for (const viewport of ['desktop', 'tablet'] as ViewportName[]) {
      const visit = await signedIn(browser(), demoAccount('editor'), viewport);
      await visit.page.goto(`${baseUrl}/models/${model.id}/reviews`);
      await visit.page
        .getByText(
          'The latest revision, revision 2, has not been reviewed; the reviews below are of earlier revisions.',
        )
        .waitFor();
      expect(await visit.page.getByText('Nobody has reviewed this model yet.').count()).toBe(0);
      await visit.page.getByRole('table').getByText('Changes requested').waitFor();
      await expectAccessible(visit.page);
      expectNoProblems(visit);
      await visit.context.close();
    }
  });
});

/** A model whose only revision the demo reviewer approved with everything ticked. */
async function approvedModel(editor: ApiClient, name: string) {
  const reviewer = await apiAs(demoAccount('reviewer'));
  const reviewerId = (await reviewer.get<{ user: { id: string } }>('/me')).user.id;
  const { model, revision } = await createModel(editor, name, SCALE);
  const review = await editor.post<{ id: string }>(`/revisions/${revision.id}/reviews`, { reviewers: [reviewerId] });
  await reviewer.post(`/reviews/${review.id}/verdicts`, {
    verdict: 'approve',
    checklist: Object.fromEntries(ALL_ITEMS.map((item) => [item, true])),
  });
  return { modelId: model.id };
}

/** The demo workspace's id, from the address the sign-in lands on. */
async function workspaceOf(page: Page): Promise<string> {
  const match = /\/w\/([0-9a-f-]{36})/.exec(page.url());
  if (match) return match[1];
  await page.waitForURL(/\/w\/[0-9a-f-]{36}/);
  return /\/w\/([0-9a-f-]{36})/.exec(page.url())![1];
}
