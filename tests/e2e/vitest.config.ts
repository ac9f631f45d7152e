import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import { BaseSequencer, type TestSpecification } from 'vitest/node';
import { pathAliases } from '../../path-aliases.ts';

// The walk over every screen reads the demo as seeded, so it goes first; the journeys
// after it add models, revisions, reviews and installs of their own.
class ScreensFirst extends BaseSequencer {
  override async sort(files: TestSpecification[]): Promise<TestSpecification[]> {
    const rank = (file: TestSpecification) => (file.moduleId.endsWith('/screens.test.ts') ? 0 : 1);
    return [...files].sort((a, b) => rank(a) - rank(b) || a.moduleId.localeCompare(b.moduleId));
  }
}

// Browser tests: the built client served by the real server against a throwaway
// PostgreSQL (global-setup.ts), driven by Debian's Chromium through playwright-core.
export default defineConfig({
  root: fileURLToPath(new URL('../..', import.meta.url)),
  resolve: { alias: pathAliases },
  test: {
    name: 'e2e',
    environment: 'node',
    include: ['tests/e2e/**/*.test.ts'],
    globalSetup: ['tests/e2e/global-setup.ts'],
    // One browser session at a time keeps a two-core machine responsive.
    fileParallelism: false,
    sequence: { sequencer: ScreensFirst },
    testTimeout: 60_000,
    hookTimeout: 180_000,
  },
});
