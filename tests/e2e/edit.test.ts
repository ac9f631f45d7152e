import { describe, expect, it } from 'vitest';
import { apiAs, createModel, fixtureText } from './support/api';
import { useBrowser } from './support/browser';
import { demoAccount } from './support/demo';
import { checksPanel, openEditorAtLine, replaceSelection, selectRestOfLine, setupText } from './support/editor';
import { saveScreenshot } from './support/screenshots';
import { expectNoProblems, signedIn } from './support/session';

const browser = useBrowser();
const editor = demoAccount('editor');
const scale = fixtureText('valid/scale-16-channel-two-receivers.yaml');
const lines = scale.split('\n');
/** The 1-based line of the fixture that starts with `start` (after its indent). */
const lineOf = (start: string) => {
  const index = lines.findIndex((line) => line.trimStart().startsWith(start));
  if (index < 0) throw new Error(`The scale fixture has no line starting with ${start}`);
  return index + 1;
};

interface Revision {
  number: number;
  message: string;
  yaml: string;
  author: { name: string } | null;
}

describe('journey: edit in the text and in the forms, then save', () => {
  it('shows a channel conflict typed into the text, clears it when fixed, takes a failsafe from the pin-map form and saves with a message', async () => {
    const api = await apiAs(editor);
    const { model } = await createModel(api, 'Plover 16 (edit journey)', scale);
    const visit = await signedIn(browser(), editor);
    const { page } = visit;

    const elevatorLine = lineOf('- { ch: 2,');
    const original = lines[elevatorLine - 1];
    await openEditorAtLine(page, model.id, elevatorLine);
    // The jump puts the cursor at the line's start once the editor has mounted; select the line from there.
    await selectRestOfLine(page, original);
    // Elevator typed onto channel 1, where the left aileron already is.
    const changed = original.replace('ch: 2, ', 'ch: 1, ');
    await replaceSelection(page, changed);
    const conflict = checksPanel(page).getByRole('link').filter({ hasText: 'channel-shared' });
    await conflict.waitFor();
    expect(await conflict.textContent()).toContain(`line ${elevatorLine}:`);
    await page.getByText('Unsaved changes').waitFor();
    await saveScreenshot(page, 'journey-03-channel-conflict', { fullPage: false });

    // The finding's link goes to its line (the address stays clean); typing the right channel back clears it.
    await conflict.click();
    await expect.poll(() => page.url()).not.toContain('?line=');
    await selectRestOfLine(page, changed);
    await replaceSelection(page, original);
    await expect
      .poll(() => checksPanel(page).textContent(), { timeout: 30_000 })
      .toContain('The setup passes every check.');
    expect(await checksPanel(page).getByText('channel-shared').count()).toBe(0);

    await page.getByRole('tab', { name: 'Pin maps' }).click();
    const pulse = page.getByLabel('Failsafe pulse of pin 1 of wing in microseconds');
    expect(await pulse.inputValue()).toBe('1500');
    await pulse.fill('1450');
    await pulse.press('Enter');
    await page.getByRole('tab', { name: 'Text' }).click();
    await setupText(page).waitFor();
    await expect
      .poll(() => checksPanel(page).textContent(), { timeout: 30_000 })
      .toContain('The setup passes every check.');
    await saveScreenshot(page, 'journey-03-failsafe-changed', { fullPage: false });

    await page.getByRole('button', { name: 'Save revision…' }).click();
    const dialog = page.getByRole('dialog', { name: 'Save as revision 2' });
    await dialog
      .getByLabel('What changed')
      .fill('Wing pin 1 failsafe 1500 -> 1450 µs: tailwheel a touch left of centre');
    await dialog.getByRole('button', { name: 'Save revision' }).click();
    await page.getByRole('region', { name: 'Notifications' }).getByText('Saved revision 2').waitFor();
    await page.getByText('No unsaved changes').waitFor();
    await saveScreenshot(page, 'journey-03-saved', { fullPage: false });

    const history = await api.get<Revision[]>(`/models/${model.id}/revisions`);
    expect(history.map((revision) => revision.number)).toEqual([2, 1]);
    expect(history[0].message).toBe('Wing pin 1 failsafe 1500 -> 1450 µs: tailwheel a touch left of centre');
    const saved = await api.get<Revision & { id: string }>(`/models/${model.id}/revisions/2`);
    // The form changed only the failsafe, in place; the fixed channel line is as it was.
    expect(saved.yaml).toContain('- { pin: 1, ch: 9,  failsafe: 1450 }');
    expect(saved.yaml).toContain(original);
    expect(saved.yaml.split('\n').length).toBe(lines.length);
    expectNoProblems(visit);
    await visit.context.close();
  });
});

describe('journey: two tabs on one model', () => {
  it('refuses the second tab’s save with 409, shows what changed meanwhile, and saves on top of the latest when asked', async () => {
    const api = await apiAs(editor);
    const { model } = await createModel(api, 'Plover 16 (two tabs)', scale);
    const visit = await signedIn(browser(), editor);
    const first = visit.page;
    const second = await visit.newTab();

    const weightLine = lineOf('weight_g:');
    const notesLine = lineOf('notes:');
    await openEditorAtLine(first, model.id, weightLine);
    await openEditorAtLine(second, model.id, notesLine);

    await first.bringToFront();
    await selectRestOfLine(first, lines[weightLine - 1]);
    await replaceSelection(first, '  weight_g: 6350');
    await first.getByText('Unsaved changes').waitFor();
    await first.getByRole('button', { name: 'Save revision…' }).click();
    await first
      .getByRole('dialog', { name: 'Save as revision 2' })
      .getByLabel('What changed')
      .fill('Weighed after the new retracts: 6350 g');
    await first.getByRole('dialog').getByRole('button', { name: 'Save revision' }).click();
    await first.getByRole('region', { name: 'Notifications' }).getByText('Saved revision 2').waitFor();

    await second.bringToFront();
    await selectRestOfLine(second, lines[notesLine - 1]);
    await replaceSelection(second, '  notes: Scale low wing, split flaps, retracts and lights.');
    await second.getByText('Unsaved changes').waitFor();
    await second.getByRole('button', { name: 'Save revision…' }).click();
    // This tab still stands on revision 1, so it asks to save revision 2 as well.
    await second.getByRole('dialog', { name: 'Save as revision 2' }).getByLabel('What changed').fill('Shorter notes');
    await second.getByRole('dialog').getByRole('button', { name: 'Save revision' }).click();

    const refusal = second.getByRole('alert').filter({ hasText: 'Not saved' });
    await refusal.getByText('Not saved: revision 2 was saved while you were editing').waitFor();
    await refusal.getByText('Weighed after the new retracts: 6350 g', { exact: false }).waitFor();
    await refusal.getByRole('heading', { name: 'Changed meanwhile (revision 1 → 2)', exact: true }).waitFor();
    expect(await refusal.locator('li').filter({ hasText: '6350' }).count()).toBeGreaterThan(0);
    await saveScreenshot(second, 'journey-04-stale-base', { fullPage: false });

    const before = await api.get<Revision[]>(`/models/${model.id}/revisions`);
    expect(before.map((revision) => revision.number)).toEqual([2, 1]);

    await refusal.getByRole('button', { name: 'Load revision 2 and re-apply my text' }).click();
    await second
      .getByRole('region', { name: 'Notifications' })
      .getByText('Your text now stands on revision 2')
      .waitFor();
    await second.getByRole('button', { name: 'Save revision…' }).click();
    await second
      .getByRole('dialog', { name: 'Save as revision 3' })
      .getByLabel('What changed')
      .fill('Shorter notes, on top of the new weight');
    await second.getByRole('dialog').getByRole('button', { name: 'Save revision' }).click();
    await second.getByRole('region', { name: 'Notifications' }).getByText('Saved revision 3').waitFor();

    const after = await api.get<Revision[]>(`/models/${model.id}/revisions`);
    expect(after.map((revision) => revision.number)).toEqual([3, 2, 1]);
    // Re-applying keeps this tab's text as it is: the weight it never had is undone, as the panel warned.
    const third = await api.get<Revision>(`/models/${model.id}/revisions/3`);
    expect(third.yaml).toContain('notes: Scale low wing, split flaps, retracts and lights.');
    expect(third.yaml).toContain('weight_g: 6200');
    expectNoProblems(visit, [409]);
    await visit.context.close();
  });
});

describe('journey: two tabs on one model, merged', () => {
  it('refuses the stale save, brings this tab’s edits onto the latest revision with one conflict decided, and saves both tabs’ changes', async () => {
    const api = await apiAs(editor);
    const { model } = await createModel(api, 'Plover 16 (two tabs merged)', scale);
    const visit = await signedIn(browser(), editor);
    const first = visit.page;
    const second = await visit.newTab();

    const weightLine = lineOf('weight_g:');
    const notesLine = lineOf('notes:');
    expect(notesLine).toBe(weightLine + 1);
    await openEditorAtLine(first, model.id, weightLine);
    await openEditorAtLine(second, model.id, weightLine);

    // The first tab weighs the model and saves revision 2.
    await first.bringToFront();
    await selectRestOfLine(first, lines[weightLine - 1]);
    await replaceSelection(first, '  weight_g: 6350');
    await first.getByText('Unsaved changes').waitFor();
    await first.getByRole('button', { name: 'Save revision…' }).click();
    await first.getByRole('dialog', { name: 'Save as revision 2' }).getByLabel('What changed').fill('Weighed: 6350 g');
    await first.getByRole('dialog').getByRole('button', { name: 'Save revision' }).click();
    await first.getByRole('region', { name: 'Notifications' }).getByText('Saved revision 2').waitFor();

    // The second tab, still on revision 1, writes another weight and shorter notes on the next line.
    await second.bringToFront();
    await selectRestOfLine(second, lines[weightLine - 1]);
    await replaceSelection(second, '  weight_g: 6400');
    await second.keyboard.press('ArrowDown');
    await second.keyboard.press('Home');
    await selectRestOfLine(second, lines[notesLine - 1].trimStart());
    await replaceSelection(second, 'notes: Scale low wing, split flaps, retracts and lights.');
    await second.getByRole('button', { name: 'Save revision…' }).click();
    await second.getByRole('dialog', { name: 'Save as revision 2' }).getByLabel('What changed').fill('Shorter notes');
    await second.getByRole('dialog').getByRole('button', { name: 'Save revision' }).click();

    const refusal = second.getByRole('alert').filter({ hasText: 'Not saved' });
    await refusal.getByText('Not saved: revision 2 was saved while you were editing').waitFor();
    // The weight was changed on both sides: this tab takes revision 2's.
    const conflict = refusal.getByRole('group', { name: 'model.weight_g' });
    const bring = refusal.getByRole('button', { name: 'Bring my edits onto revision 2' });
    expect(await bring.isDisabled()).toBe(true);
    await conflict.getByLabel('Keep revision 2’s').check();
    await saveScreenshot(second, 'journey-stale-tab-merge', { fullPage: false });
    await bring.click();
    await second
      .getByRole('region', { name: 'Notifications' })
      .getByText('Your text now stands on revision 2')
      .waitFor();

    await second.getByRole('button', { name: 'Save revision…' }).click();
    await second
      .getByRole('dialog', { name: 'Save as revision 3' })
      .getByLabel('What changed')
      .fill('Shorter notes, on the measured weight');
    await second.getByRole('dialog').getByRole('button', { name: 'Save revision' }).click();
    await second.getByRole('region', { name: 'Notifications' }).getByText('Saved revision 3').waitFor();

    const third = await api.get<Revision>(`/models/${model.id}/revisions/3`);
    expect(third.yaml).toContain('  weight_g: 6350\n');
    expect(third.yaml).toContain('notes: Scale low wing, split flaps, retracts and lights.');
    expect(third.yaml).not.toContain('6400');
    // The merge wrote only the two settings' lines: every other line (comments, aligned
    // flow entries) is as revision 1 had it.
    const untouched = lines.filter((_, index) => index !== weightLine - 1 && index !== notesLine - 1);
    const thirdLines = third.yaml.split('\n');
    expect(thirdLines.filter((_, index) => index !== weightLine - 1 && index !== notesLine - 1)).toEqual(untouched);
    expect(thirdLines[weightLine - 1]).toBe('  weight_g: 6350');
    expect(thirdLines[notesLine - 1]).toBe('  notes: Scale low wing, split flaps, retracts and lights.');

    // Beside the gutter, each line names the revision that last changed it: the weight the
    // other tab's, the notes this one's.
    await second.getByLabel('Show where each line came from').check();
    await second.locator('.cm-origin-mark').first().waitFor();
    const marks = await second
      .locator('.cm-origin-mark')
      .evaluateAll((elements) =>
        elements.slice(0, 4).map((element) => `${element.textContent} ${element.getAttribute('title')}`),
      );
    // The first lines' settings (format, name, airframe) are as revision 1 set them.
    expect(marks[0]).toMatch(/^r1 since r1, /);
    const weightMark = await second.locator('.cm-origin-mark', { hasText: 'r2' }).first().getAttribute('title');
    expect(weightMark).toContain('‘Weighed: 6350 g’');
    const notesMark = await second.locator('.cm-origin-mark', { hasText: 'r3' }).first().getAttribute('title');
    expect(notesMark).toContain('‘Shorter notes, on the measured weight’');

    // The keyboard reaches the same words: the status line under the editor says the cursor line's mark.
    const status = second.getByRole('status').filter({ hasText: /^Line \d+: / });
    await setupText(second).focus();
    await second.keyboard.press('Control+Home');
    await status.getByText(/^Line 1: /).waitFor();
    expect(await status.getAttribute('aria-live')).toBe('polite');
    for (let step = 0; step < 40; step += 1) {
      if ((await status.textContent())?.startsWith(`Line ${weightLine}: `)) break;
      await second.keyboard.press('ArrowDown');
    }
    expect(await status.textContent()).toBe(`Line ${weightLine}: ${weightMark}`);
    await second.keyboard.press('ArrowDown');
    await status.getByText(`Line ${notesLine}: ${notesMark}`).waitFor();
    await status.scrollIntoViewIfNeeded();
    await saveScreenshot(second, 'journey-line-origin-status', { fullPage: false });
    await saveScreenshot(second, 'journey-line-origins', { fullPage: false });
    expectNoProblems(visit, [409]);
    await visit.context.close();
  });
});
