import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// Browser tests: the built client served by the real server against a throwaway
// PostgreSQL (global-setup.ts), driven by Debian's Chromium through playwright-core.
export default defineConfig({
  root: fileURLToPath(new URL('../..', import.meta.url)),
  test: {
    name: 'e2e',
    environment: 'node',
    include: ['tests/e2e/**/*.test.ts'],
    globalSetup: ['tests/e2e/global-setup.ts'],
    // One browser session at a time keeps a two-core machine responsive.
    fileParallelism: false,
    testTimeout: 60_000,
    hookTimeout: 180_000,
  },
});
