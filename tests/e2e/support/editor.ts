import type { Page } from 'playwright-core';
import { baseUrl } from './demo';

/** The Edit screen's text editor (CodeMirror), found by the label the screen gives it. */
export const setupText = (page: Page) => page.locator('.cm-content[contenteditable="true"]');

/** Opens a model's Edit screen with a line of its text selected, as a finding's link does. */
export async function openEditorAtLine(page: Page, modelId: string, line: number): Promise<void> {
  await page.goto(`${baseUrl}/models/${modelId}/edit?line=${line}`);
  await setupText(page).waitFor();
  await page.getByRole('complementary', { name: 'Checks' }).getByText('The setup passes every check.').waitFor();
}

/** What the page has selected: the editor's selection while it has the focus. */
export const selectedText = (page: Page) => page.evaluate(() => document.getSelection()?.toString() ?? '');

/** Types over the selected line, as a pilot does after picking it. */
export async function replaceSelection(page: Page, text: string): Promise<void> {
  await page.keyboard.insertText(text);
}

/** The Checks panel beside the editor. */
export const checksPanel = (page: Page) => page.getByRole('complementary', { name: 'Checks' });
