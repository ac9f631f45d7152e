import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import { pathAliases } from './path-aliases.ts';

// Three projects: pure shared code, the API against a real PostgreSQL started by
// tests/api/global-setup.ts, and React components in jsdom.
export default defineConfig({
  resolve: { alias: pathAliases },
  test: {
    globals: true,
    projects: [
      {
        extends: true,
        // The command-line and lint tests start processes; a busy machine needs room.
        test: {
          name: 'shared',
          globals: true,
          environment: 'node',
          include: ['tests/shared/**/*.test.ts'],
          testTimeout: 30_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'api',
          globals: true,
          environment: 'node',
          include: ['tests/api/**/*.test.ts'],
          globalSetup: ['tests/api/global-setup.ts'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: true,
        plugins: [react()],
        test: {
          name: 'web',
          globals: true,
          environment: 'jsdom',
          include: ['tests/web/**/*.test.tsx', 'tests/web/**/*.test.ts'],
          setupFiles: ['tests/web/setup.ts'],
          // Component journeys type and wait like a user; a busy 2-core machine needs room.
          testTimeout: 15_000,
        },
      },
    ],
  },
});
