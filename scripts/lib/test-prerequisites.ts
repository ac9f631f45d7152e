import { existsSync } from 'node:fs';
import { findPostgresBinaries } from '@api/db/cluster';
import { ensureDebianPackage } from '@api/db/debian-package';
import { CHROMIUM_PATH } from './chromium-path';

/**
 * What the tests need from the machine, installed when missing: PostgreSQL's server
 * programs (the API tests start a throwaway cluster) and Debian's Chromium (the browser
 * tests drive it; a browser build downloaded by a test tool cannot be fetched here).
 */
export async function ensureTestPrerequisites(): Promise<void> {
  await findPostgresBinaries();
  await ensureDebianPackage({
    name: 'chromium',
    purpose: 'The browser tests',
    isPresent: () => existsSync(CHROMIUM_PATH),
  });
}
