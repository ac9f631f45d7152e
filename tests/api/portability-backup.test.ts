import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bin, projectRoot } from '../../scripts/lib/paths';
import { openTestDatabase, type TestDatabase } from './helpers/test-database';

// npm run backup / npm run restore against a database of this file's own (DATABASE_URL),
// run as the scripts themselves, the way a pilot runs them.
let database: TestDatabase;
let folder: string;

beforeAll(async () => {
  database = await openTestDatabase();
  folder = mkdtempSync(path.join(os.tmpdir(), 'bindery-backup-'));
});

afterAll(async () => {
  await database?.close();
  rmSync(folder, { recursive: true, force: true });
});

function script(name: 'backup' | 'restore', ...args: string[]) {
  const result = spawnSync(bin('tsx'), [path.join(projectRoot, 'scripts', `${name}.ts`), ...args], {
    cwd: projectRoot,
    env: { ...process.env, DATABASE_URL: database.url },
    encoding: 'utf8',
  });
  return { code: result.status, output: `${result.stdout}${result.stderr}` };
}

async function withClient<T>(work: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: database.url });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

const workspaceNames = () =>
  withClient(async (client) =>
    (await client.query<{ name: string }>('SELECT name FROM workspaces ORDER BY name')).rows.map((row) => row.name),
  );

describe('npm run backup and npm run restore', () => {
  it('backs up, refuses to restore without --yes or under another connection, and restores everything as it was', async () => {
    await withClient((client) => client.query("INSERT INTO workspaces (name) VALUES ('Before the backup')"));
    const file = path.join(folder, 'nightly.dump');
    const backup = script('backup', '--output', file);
    expect(backup.output).toContain('1 workspaces');
    expect(backup.code).toBe(0);
    expect(existsSync(file)).toBe(true);

    await withClient((client) => client.query("INSERT INTO workspaces (name) VALUES ('After the backup')"));

    const unconfirmed = script('restore', file);
    expect(unconfirmed.code).toBe(1);
    expect(unconfirmed.output).toContain('--yes');
    expect(await workspaceNames()).toEqual(['After the backup', 'Before the backup']);

    const busy = new pg.Client({ connectionString: database.url });
    await busy.connect();
    const refused = script('restore', file, '--yes');
    await busy.end();
    expect(refused.code).toBe(1);
    expect(refused.output).toContain('other connection');
    expect(await workspaceNames()).toEqual(['After the backup', 'Before the backup']);

    const restored = script('restore', file, '--yes');
    expect(restored.output).toContain('Restored');
    expect(restored.code).toBe(0);
    expect(await workspaceNames()).toEqual(['Before the backup']);
    // The schema came back whole: the trigger that keeps revisions immutable and the migration record.
    const triggers = await withClient(async (client) =>
      (
        await client.query<{ tgname: string }>(
          "SELECT tgname FROM pg_trigger WHERE tgname LIKE 'revisions_%' ORDER BY tgname",
        )
      ).rows.map((row) => row.tgname),
    );
    expect(triggers).toEqual(['revisions_immutable', 'revisions_no_truncate', 'revisions_sequence']);
  });

  it('refuses a file that is not a backup and changes nothing', async () => {
    const before = await workspaceNames();
    const result = script('restore', path.join(projectRoot, 'package.json'), '--yes');
    expect(result.code).toBe(2);
    expect(result.output).toContain('not a backup');
    expect(await workspaceNames()).toEqual(before);
  });
});
