import type { Page } from 'playwright-core';
import { expect } from 'vitest';
import { baseUrl } from './demo';

/** The Edit screen's text editor (CodeMirror), found by the label the screen gives it. */
export const setupText = (page: Page) => page.locator('.cm-content[contenteditable="true"]');

/** Opens a model's Edit screen with the cursor at the start of a line, as a finding's link does. */
export async function openEditorAtLine(page: Page, modelId: string, line: number): Promise<void> {
  await page.goto(`${baseUrl}/models/${modelId}/edit?line=${line}`);
  await setupText(page).waitFor();
  await page.getByRole('complementary', { name: 'Checks' }).getByText('The setup passes every check.').waitFor();
}

/** What the page has selected: the editor's selection while it has the focus. */
export const selectedText = (page: Page) => page.evaluate(() => document.getSelection()?.toString() ?? '');

/**
 * Selects from the cursor to the end of its line and waits until that is `line`: the
 * jump leaves the cursor at the line's start with nothing selected.
 */
export async function selectRestOfLine(page: Page, line: string): Promise<void> {
  await expect.poll(() => selectedText(page)).toBe('');
  // A wrapped line ends at each wrap point first: extend to the next boundary until the whole line is in.
  for (let step = 0; step < 6 && (await selectedText(page)) !== line; step += 1) await page.keyboard.press('Shift+End');
  await expect.poll(() => selectedText(page)).toBe(line);
}

/** Types over the selected line, as a pilot does after picking it. */
export async function replaceSelection(page: Page, text: string): Promise<void> {
  await page.keyboard.insertText(text);
}

/** The Checks panel beside the editor. */
export const checksPanel = (page: Page) => page.getByRole('complementary', { name: 'Checks' });
