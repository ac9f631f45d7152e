import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { DEFAULT_CLUB_RULES } from '@shared/rules/club-rules';
import { apiAs, createModel, demoModel, demoWorkspaceId, fixtureText } from './support/api';
import { useBrowser } from './support/browser';
import { baseUrl, demoAccount } from './support/demo';
import { saveScreenshot } from './support/screenshots';
import { expectNoProblems, signedIn } from './support/session';

const browser = useBrowser();

interface RevisionSummary {
  id: string;
  number: number;
  message: string;
  created_at: string;
  author: { name: string } | null;
}

const DAY = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

describe('journey: where a value came from', () => {
  it('a reviewer hovers the Kestrel’s wing pin 1 failsafe on the Overview and reads the revision that set it', async () => {
    const reviewer = demoAccount('reviewer');
    const api = await apiAs(reviewer);
    const kestrel = await demoModel(api, 'Kestrel Mk II');
    // The demo seed's revision 4 fixed the wing receiver's pin 1 failsafe.
    const history = await api.get<RevisionSummary[]>(`/models/${kestrel.id}/revisions`);
    const fix = history.find((revision) => revision.number === 4)!;
    const visit = await signedIn(browser(), reviewer);
    const { page } = visit;
    await page.goto(`${baseUrl}/models/${kestrel.id}/overview`);
    await page.getByRole('heading', { name: 'Receivers and their pins' }).waitFor();

    const wing = page.getByRole('list', { name: /^Pins of .*wing/i });
    const failsafe = wing.getByRole('listitem').nth(0).locator('[data-provenance$=".failsafe"]');
    await failsafe.hover();
    const tooltip = failsafe.getByRole('tooltip');
    await tooltip.waitFor({ state: 'visible' });
    expect(await tooltip.textContent()).toBe(
      `since r4, ${fix.author!.name}, ${DAY.format(new Date(fix.created_at))}: ‘${fix.message}’`,
    );
    await saveScreenshot(page, 'journey-provenance-hover');

    // The same note by keyboard: focusing the value shows it too.
    await page.mouse.move(0, 0);
    await failsafe.focus();
    await tooltip.waitFor({ state: 'visible' });
    expectNoProblems(visit);
    await visit.context.close();
  });
});

describe('journey: a fork takes in its source’s fix', () => {
  it('an editor sees the source’s newer revision on the fork’s Overview, chooses a side for one conflict and saves the merge', async () => {
    const editor = demoAccount('editor');
    const api = await apiAs(editor);
    const workspaceId = await demoWorkspaceId(api);
    const trainer = fixtureText('valid/trainer-single-receiver.yaml');
    const source = await createModel(api, 'Merge source trainer', trainer);
    const fork = await api.post<{ model: { id: string } }>(`/models/${source.model.id}/fork`, {
      number: 1,
      workspace: workspaceId,
      name: 'Merge fork trainer',
    });
    await api.post(`/models/${source.model.id}/revisions`, {
      base: 1,
      message: 'Aileron failsafe at the measured centre; softer ailerons',
      yaml: trainer
        .replace('{ pin: 1, ch: 1, failsafe: 1500 }', '{ pin: 1, ch: 1, failsafe: 1520 }')
        .replace('expo: 30,', 'expo: 35,'),
    });
    await api.post(`/models/${fork.model.id}/revisions`, {
      base: 1,
      message: 'Our own aileron expo',
      yaml: trainer.replace('expo: 30,', 'expo: 40,'),
    });

    const visit = await signedIn(browser(), editor);
    const { page } = visit;
    await page.goto(`${baseUrl}/models/${fork.model.id}/overview`);
    const notice = page.getByRole('region', { name: 'Source updates' });
    await notice.getByText('The source has 1 newer revision').waitFor();
    await saveScreenshot(page, 'journey-fork-behind');
    await notice.getByRole('link', { name: 'Take in the changes' }).click();

    await page.getByRole('heading', { name: 'Changed on both sides: choose which to keep' }).waitFor();
    const conflict = page.getByRole('group', { name: 'mixes[id=aileron].expo' });
    const save = page.getByRole('button', { name: 'Save revision 3 with these changes' });
    expect(await save.isDisabled()).toBe(true);
    await conflict.getByLabel(/Keep the source’s/).check();
    await saveScreenshot(page, 'journey-fork-merge');
    await save.click();
    await page.waitForURL(/\/overview$/);

    const latest = await api.get<{ yaml: string; origin: string }>(
      `/revisions/${(await api.get<RevisionSummary[]>(`/models/${fork.model.id}/revisions`))[0].id}`,
    );
    expect(latest.origin).toBe('merge');
    const data = parse(latest.yaml);
    expect(data.receivers[0].map[0].failsafe).toBe(1520);
    expect(data.mixes[0].expo).toBe(35);
    // The fork's text with only the two settings written in: comments and aligned flow entries as they were.
    expect(latest.yaml).toBe(
      trainer
        .replace('{ pin: 1, ch: 1, failsafe: 1500 }', '{ pin: 1, ch: 1, failsafe: 1520 }')
        .replace('expo: 30,', 'expo: 35,'),
    );
    expectNoProblems(visit);
    await visit.context.close();
  });
});

describe('journey: an owner raises a check to an error', () => {
  it('sets failsafe-unset to error on the Team screen, and the hangar counts the warning as an error', async () => {
    const owner = demoAccount('owner');
    const api = await apiAs(owner);
    const workspaceId = await demoWorkspaceId(api);
    const name = 'Rules trainer';
    await createModel(
      api,
      name,
      fixtureText('valid/trainer-single-receiver.yaml').replace(
        '{ pin: 4, ch: 4, failsafe: 1500 }',
        '{ pin: 4, ch: 4 }',
      ),
    );
    const visit = await signedIn(browser(), owner);
    const { page } = visit;
    try {
      const row = page.getByRole('row').filter({ has: page.getByRole('link', { name, exact: true }) });
      await page.goto(`${baseUrl}/w/${workspaceId}/hangar`);
      await row.getByText('1 warning').waitFor();

      await page.goto(`${baseUrl}/w/${workspaceId}/team`);
      await page.getByRole('heading', { name: 'Club rules' }).waitFor();
      await page.getByLabel('Set another check').selectOption('failsafe-unset');
      await page.getByRole('button', { name: 'Add', exact: true }).click();
      expect(await page.getByLabel('Severity of failsafe-unset').inputValue()).toBe('error');
      await page.getByRole('button', { name: 'Save the rules' }).click();
      const changes = page.getByRole('list', { name: 'Changes to the rules' });
      await changes.getByText('failsafe-unset: warning → error').waitFor();
      await saveScreenshot(page, 'journey-club-rules');

      await page.goto(`${baseUrl}/w/${workspaceId}/hangar`);
      await row.getByText('1 error').waitFor();
      expect(await row.getByText('1 warning').count()).toBe(0);
      await saveScreenshot(page, 'journey-club-rules-hangar');
      expectNoProblems(visit);
    } finally {
      // The journeys after this one read the demo under the format's own severities.
      await api.put(`/workspaces/${workspaceId}/rules`, DEFAULT_CLUB_RULES);
      await visit.context.close();
    }
  });
});
