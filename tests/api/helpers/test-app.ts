import { randomBytes } from 'node:crypto';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import { afterAll, beforeAll } from 'vitest';
import { createApp } from '@api/app';
import { defaultConfig, type AppConfig } from '@api/config';
import { openTestDatabase, type TestDatabase } from './test-database';

export type ConfigOverrides = Partial<AppConfig>;

export function testConfig(overrides: ConfigOverrides = {}): AppConfig {
  return defaultConfig({
    jwtSecret: randomBytes(32).toString('hex'),
    // Tests sign in often; the rate-limit tests set their own low numbers.
    signInLimits: { windowMs: 60_000, perAccount: 1_000, perAccountAnyAddress: 1_000, perAddress: 1_000 },
    logErrors: false,
    ...overrides,
  });
}

export interface TestApp {
  app: Express;
  config: AppConfig;
  sequelize: Sequelize;
  database: TestDatabase;
  /** Another app on the same database with other settings (e.g. low rate limits). */
  appWith(overrides: ConfigOverrides): { app: Express; config: AppConfig };
}

/**
 * Gives the test file its own database and an app on it: call once at the top of a
 * file; the fields are there from beforeAll on, and everything is dropped afterAll.
 */
export function useTestApp(overrides: ConfigOverrides = {}): TestApp {
  const handle = {} as TestApp;
  beforeAll(async () => {
    const database = await openTestDatabase();
    const config = testConfig(overrides);
    Object.assign(handle, {
      database,
      sequelize: database.sequelize,
      config,
      app: createApp({ sequelize: database.sequelize, config }),
      appWith: (more: ConfigOverrides) => {
        const other = testConfig({ ...overrides, ...more });
        return { app: createApp({ sequelize: database.sequelize, config: other }), config: other };
      },
    } satisfies TestApp);
  });
  afterAll(async () => {
    await handle.database?.close();
  });
  return handle;
}
