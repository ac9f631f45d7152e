import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Page } from 'playwright-core';

// screenshots/ at the repository root, ignored by git: one picture per journey and screen.
export const SCREENSHOT_DIR = fileURLToPath(new URL('../../../screenshots', import.meta.url));

/**
 * Saves the page as screenshots/<name>.png and answers the file's path. `fullPage: false`
 * keeps to the window, for screens whose text editor draws only the lines in view.
 */
export async function saveScreenshot(
  page: Page,
  name: string,
  { fullPage = true }: { fullPage?: boolean } = {},
): Promise<string> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${name.replace(/[^a-z0-9-]+/gi, '-')}.png`);
  // Carets and animations would make two pictures of one screen differ.
  await page.screenshot({ path: file, fullPage, animations: 'disabled', caret: 'hide' });
  return file;
}
