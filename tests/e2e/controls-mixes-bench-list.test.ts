import { writeFileSync } from 'node:fs';
import path from 'node:path';
import pdfParse from 'pdf-parse/lib/pdf-parse.js';
import { parse } from 'yaml';
import { describe, expect, it } from 'vitest';
import { seriousA11yViolations } from './support/axe';
import { apiAs, createModel, demoWorkspaceId, fixtureText } from './support/api';
import { useBrowser, type ViewportName } from './support/browser';
import { baseUrl, demoAccount } from './support/demo';
import { setupText } from './support/editor';
import { saveScreenshot, SCREENSHOT_DIR } from './support/screenshots';
import { expectNoProblems, signedIn } from './support/session';
import type { Page } from 'playwright-core';

// Issue 16's forms and the reuse check's bench list, as a pilot meets them: the
// Controls-and-link form and the Add a mix dialog from the keyboard alone, and the
// printable bench list of a receiver moved from a trainer into another airframe; at
// both widths, with axe and no console errors.

const browser = useBrowser();
const editor = demoAccount('editor');
const trainer = fixtureText('valid/trainer-single-receiver.yaml');

interface SavedRevision {
  number: number;
  yaml: string;
}

async function openTab(page: Page, modelId: string, tab: string): Promise<void> {
  await page.goto(`${baseUrl}/models/${modelId}/edit`);
  await setupText(page).waitFor();
  // Keyboard only: the tab list takes the focus on its selected tab, arrows move along it.
  await page.getByRole('tab', { name: 'Text' }).focus();
  for (let step = 0; step < 5 && !(await page.getByRole('tab', { name: tab, selected: true }).count()); step += 1)
    await page.keyboard.press('ArrowRight');
  await page.getByRole('tab', { name: tab, selected: true }).waitFor();
}

async function saveFromKeyboard(page: Page, number: number, message: string): Promise<void> {
  const open = page.getByRole('button', { name: 'Save revision…' });
  // The button waits for the checks of the edited text to finish.
  await expect.poll(() => open.isEnabled(), { timeout: 20_000 }).toBe(true);
  await open.focus();
  await page.keyboard.press('Enter');
  const save = page.getByRole('dialog', { name: `Save as revision ${number}` });
  await save.getByLabel('What changed').waitFor();
  await save.getByLabel('What changed').focus();
  await page.keyboard.type(message);
  await save.getByRole('button', { name: 'Save revision' }).focus();
  await page.keyboard.press('Enter');
  await page.getByRole('region', { name: 'Notifications' }).getByText(`Saved revision ${number}`).waitFor();
}

describe.each(['desktop', 'tablet'] as ViewportName[])('forms and the bench list at %s', (viewport) => {
  it('a pilot changes the link’s channel count and a control from the keyboard; a count out of range is refused beside the field', async () => {
    const api = await apiAs(editor);
    const { model } = await createModel(api, `Link form (${viewport})`, trainer);
    const visit = await signedIn(browser(), editor, viewport);
    const { page } = visit;
    await openTab(page, model.id, 'Controls and link');

    const count = page.getByLabel('Channels the link carries, 4 to 32');
    await count.focus();
    await page.keyboard.press('ControlOrMeta+A');
    await page.keyboard.type('40');
    await page.keyboard.press('Enter');
    const message = 'The channel count is a whole number from 4 to 32.';
    await page.getByText(message).waitFor();
    expect(await count.getAttribute('aria-invalid')).toBe('true');
    const describedBy = await count.getAttribute('aria-describedby');
    expect(await page.locator(`[id="${describedBy}"]`).textContent()).toContain(message);
    await saveScreenshot(page, `issue16-link-form-refused-${viewport}`, { fullPage: false });
    expect(await seriousA11yViolations(page)).toEqual([]);
    // Nothing was saved: the model still has its first revision alone.
    const history = await api.get<{ number: number }[]>(`/models/${model.id}/revisions`);
    expect(history.map((revision) => revision.number)).toEqual([1]);

    // Escape puts the document's value back; a count in range goes in.
    await page.keyboard.press('Escape');
    expect(await count.inputValue()).toBe('8');
    await page.keyboard.press('ControlOrMeta+A');
    await page.keyboard.type('12');
    await page.keyboard.press('Enter');
    expect(await count.getAttribute('aria-invalid')).toBeNull();

    // The rate switch becomes a three-position switch, picked with the arrow keys.
    const positions = page.getByLabel('Positions of switch rate-switch');
    await positions.focus();
    await page.keyboard.press('ArrowDown');
    await expect.poll(() => positions.inputValue()).toBe('3');
    const label = page.getByLabel('Label of control rate-switch');
    await label.focus();
    await page.keyboard.type('Rates (left shoulder)');
    await page.keyboard.press('Enter');
    await saveScreenshot(page, `issue16-link-form-${viewport}`);

    await saveFromKeyboard(page, 2, 'Twelve channels and a three-position rate switch');
    const saved = await api.get<SavedRevision>(`/models/${model.id}/revisions/2`);
    const doc = parse(saved.yaml) as {
      link: { channels: number };
      controls: { id: string; positions?: number; label?: string }[];
    };
    expect(doc.link.channels).toBe(12);
    expect(doc.controls.find((control) => control.id === 'rate-switch')).toEqual({
      id: 'rate-switch',
      kind: 'switch',
      positions: 3,
      label: 'Rates (left shoulder)',
    });
    // The comment on the motor's failsafe line survives a form edit.
    expect(saved.yaml).toContain('# motor stops on signal loss');
    expectNoProblems(visit);
    await visit.context.close();
  });

  it('Add a mix proposes no control when every one is in use (mixes, rates, cut) and a channel nothing drives; Escape leaves without adding; adding saves the mix', async () => {
    const api = await apiAs(editor);
    const { model } = await createModel(api, `Add a mix (${viewport})`, trainer);
    const visit = await signedIn(browser(), editor, viewport);
    const { page } = visit;
    await openTab(page, model.id, 'Mixes');

    const open = page.getByRole('button', { name: 'Add a mix…' });
    await open.focus();
    await page.keyboard.press('Enter');
    const dialog = page.getByRole('dialog', { name: 'Add a mix' });
    const from = dialog.getByLabel('From control');
    const to = dialog.getByLabel('To channel');
    await from.waitFor();
    // The trainer's four sticks each feed their own channel 1-4, rate-switch switches the rates and
    // motor-arm is the motor's cut: every control is in use, so the dialog proposes none and asks.
    expect(await from.inputValue()).toBe('');
    await dialog.getByText(/Every control already does something/).waitFor();
    expect(await from.locator('option', { hasText: 'motor-arm' }).textContent()).toBe('motor-arm (used by the cut)');
    expect(await from.locator('option', { hasText: 'rate-switch' }).textContent()).toBe(
      'rate-switch (used by dual rates)',
    );
    expect(Number(await to.inputValue())).toBeGreaterThan(4);
    expect(await to.evaluate((select: HTMLSelectElement) => select.selectedOptions[0]?.textContent ?? '')).toMatch(
      /nothing planned/,
    );
    expect(await dialog.getByRole('status').count()).toBe(0);
    await expect.poll(() => from.evaluate((element) => element === document.activeElement)).toBe(true);
    await saveScreenshot(page, `issue16-add-mix-${viewport}`, { fullPage: false });
    expect(await seriousA11yViolations(page)).toEqual([]);

    // Escape closes it, adds nothing, and gives the focus back to the button that opened it.
    await page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'detached' });
    await expect.poll(() => open.evaluate((element) => element === document.activeElement)).toBe(true);
    expect(await page.getByRole('table', { name: 'Mixes' }).getByRole('row').count()).toBe(5);

    // Adding without a control is refused beside the field; the pilot then picks one from the keyboard.
    await page.keyboard.press('Enter');
    await from.waitFor();
    await dialog.getByRole('button', { name: 'Add the mix' }).focus();
    await page.keyboard.press('Enter');
    await dialog.getByText('Choose the control this mix moves with.').waitFor();
    await from.focus();
    await page.keyboard.press('End');
    await expect.poll(() => from.inputValue()).toBe('motor-arm');
    expect(await dialog.getByText('Choose the control this mix moves with.').count()).toBe(0);

    // Choosing a channel that already has a mix says so before anything is added.
    const proposed = { from: await from.inputValue(), to: Number(await to.inputValue()) };
    await to.focus();
    await page.keyboard.press('Home');
    await dialog
      .getByRole('status')
      .getByText(/Channel 1 is already fed by aileron/)
      .waitFor();
    for (let step = 0; step < proposed.to - 1; step += 1) await page.keyboard.press('ArrowDown');
    await expect.poll(() => to.inputValue()).toBe(String(proposed.to));
    expect(await dialog.getByRole('status').count()).toBe(0);
    await dialog.getByRole('button', { name: 'Add the mix' }).focus();
    await page.keyboard.press('Enter');
    await dialog.waitFor({ state: 'detached' });
    expect(await page.getByRole('table', { name: 'Mixes' }).getByRole('row').count()).toBe(6);
    await saveScreenshot(page, `issue16-mix-added-${viewport}`);

    await saveFromKeyboard(page, 2, 'A mix for the spare channel');
    const saved = await api.get<SavedRevision>(`/models/${model.id}/revisions/2`);
    const mixes = (parse(saved.yaml) as { mixes: { from: string; to: number }[] }).mixes;
    expect(mixes).toHaveLength(5);
    expect(mixes[4]).toMatchObject(proposed);
    expect(mixes.filter((mix) => mix.to === proposed.to)).toHaveLength(1);
    expectNoProblems(visit);
    await visit.context.close();
  });

  it('a trainer’s receiver moved into the wing of another airframe gets a printable bench list, safety first, with the re-bind step', async () => {
    const api = await apiAs(editor);
    const workspaceId = await demoWorkspaceId(api);
    await createModel(
      api,
      `Bench list airframe (${viewport})`,
      fixtureText('valid/scale-16-channel-two-receivers.yaml'),
    );
    const unit = parse(fixtureText('reuse/trainer-unit.yaml')) as Record<string, unknown>;
    const receiver = await api.post<{ id: string; label: string }>(`/workspaces/${workspaceId}/receivers`, {
      ...unit,
      label: `Trainer unit (${viewport})`,
    });

    const visit = await signedIn(browser(), editor, viewport);
    const { page } = visit;
    await page.goto(`${baseUrl}/w/${workspaceId}/shelf/${receiver.id}`);
    await page.getByRole('heading', { name: receiver.label, exact: true }).waitFor();

    // Failsafes are recorded from a list, as in the editor, not typed as free text.
    await page.getByRole('button', { name: 'Record what it holds' }).click();
    const pin5 = page.getByRole('combobox', { name: 'Failsafe of pin 5' });
    await pin5.waitFor();
    expect(await pin5.inputValue()).toBe('hold');
    expect(await pin5.locator('option').allTextContents()).toEqual([
      'Pulse (µs)',
      'Hold last pulse',
      'Off (no pulses)',
      "Not set (the receiver's own default)",
    ]);
    expect(await page.getByRole('combobox', { name: 'Failsafe of pin 3' }).inputValue()).toBe('pulse');
    expect(await page.getByLabel('Failsafe pulse of pin 3 in microseconds').inputValue()).toBe('988');
    await saveScreenshot(page, `issue16-stored-settings-${viewport}`);
    expect(await seriousA11yViolations(page)).toEqual([]);
    await page.getByRole('button', { name: 'Cancel' }).click();

    await page.getByRole('button', { name: 'Install into a model' }).click();
    await page.getByLabel('Model').selectOption({ label: `Bench list airframe (${viewport})` });
    const slot = page.getByLabel('As which receiver of the setup');
    await slot.locator('option', { hasText: /^wing/ }).waitFor({ state: 'attached' });
    const wing = await slot.locator('option', { hasText: /^wing/ }).getAttribute('value');
    await slot.selectOption(wing ?? '');
    await page.getByText('What would have to change on the unit').waitFor();
    await page.getByRole('button', { name: 'Install it here' }).click();
    await page
      .getByRole('region', { name: 'Notifications' })
      .getByText(`${receiver.label} is now receiver wing of Bench list airframe (${viewport})`)
      .waitFor();

    const bench = page.getByRole('group', { name: 'Program these on the unit' });
    await bench.getByRole('heading', { name: 'Safety first' }).waitFor();
    const listAfter = (heading: string) =>
      bench.locator('h3', { hasText: heading }).locator('xpath=following-sibling::ul[1]').textContent();
    // The old 988 µs failsafe (the last airframe's throttle) and telemetry off lead the list,
    // though the wing slot carries no throttle; the remaps and the centred failsafes follow.
    const safety = (await listAfter('Safety first')) ?? '';
    const rest = (await listAfter('Then the rest')) ?? '';
    expect(safety).toMatch(/telemetry/i);
    expect(safety).toContain('Pin 3: failsafe 988 µs, set hold');
    expect(safety).toContain('drives this output to its end on signal loss');
    expect(rest).not.toMatch(/telemetry/i);
    expect(rest).not.toMatch(/988/);
    expect(rest).toMatch(/channel/i);
    expect(rest).toContain('Pin 2: failsafe 1500 µs, set hold');
    await page.getByRole('heading', { name: 'Re-bind and check again' }).waitFor();
    expect(await seriousA11yViolations(page)).toEqual([]);
    await saveScreenshot(page, `issue16-bench-list-${viewport}`);

    // The print view: the list, the re-bind step and the cautions, without the buttons.
    await page.emulateMedia({ media: 'print' });
    expect(await page.getByRole('button', { name: 'Print the bench list' }).isVisible()).toBe(false);
    await saveScreenshot(page, `issue16-bench-list-print-${viewport}`);
    const printout = await page.pdf({ format: 'A4', printBackground: true });
    writeFileSync(path.join(SCREENSHOT_DIR, `issue16-bench-list-${viewport}.pdf`), printout);
    const printed = (await pdfParse(printout)).text.replace(/\s+/g, ' ');
    expect(printed).toContain('Safety first');
    expect(printed).toContain('Re-bind and check again');
    expect(printed).toMatch(/988 [µμ]s/);
    expect(printed.indexOf('Safety first')).toBeLessThan(printed.indexOf('Re-bind and check again'));
    expect(printed).not.toContain('Print the bench list');
    expect(printed).not.toContain('I have applied these settings');
    await page.emulateMedia({ media: 'screen' });
    expectNoProblems(visit);
    await visit.context.close();
  });
});
