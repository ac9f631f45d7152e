import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { migrate } from '@api/db/migrate';
import { Membership, User, Workspace } from '@api/models';
import { migrations } from '@api/migrations';
import { seedDemo } from '@api/seed';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_WORKSPACE_NAME } from '@api/seed/demo-data';
import { useTestApp } from './helpers/test-app';

const t = useTestApp();

describe('migrations', () => {
  it('are all recorded as applied, and running them again applies nothing', async () => {
    const rows = await t.sequelize.query<{ name: string }>('SELECT name FROM schema_migrations ORDER BY name', {
      type: QueryTypes.SELECT,
    });
    expect(rows.map((row) => row.name)).toEqual(migrations.map((migration) => migration.name));
    expect(await migrate(t.sequelize)).toEqual([]);
  });

  it('keep migration names numbered and in order', () => {
    const names = migrations.map((migration) => migration.name);
    for (const name of names) expect(name).toMatch(/^\d{4}-[a-z0-9-]+$/);
    expect([...names].sort()).toEqual(names);
  });

  it('the database refuses a role outside the four, even by direct SQL', async () => {
    const [user] = await t.sequelize.query<{ id: string }>(
      `INSERT INTO users (email, name, password_hash) VALUES ('sql@test.example', 'S', 'x') RETURNING id`,
      { type: QueryTypes.SELECT },
    );
    const [workspace] = await t.sequelize.query<{ id: string }>(
      `INSERT INTO workspaces (name) VALUES ('W') RETURNING id`,
      { type: QueryTypes.SELECT },
    );
    await expect(
      t.sequelize.query(`INSERT INTO memberships (workspace_id, user_id, role) VALUES ($1, $2, 'admin')`, {
        bind: [workspace.id, user.id],
      }),
    ).rejects.toThrow(/check constraint/);
  });

  it('the database refuses an e-mail not in lower case', async () => {
    await expect(
      t.sequelize.query(`INSERT INTO users (email, name, password_hash) VALUES ('Upper@test.example', 'U', 'x')`),
    ).rejects.toThrow(/users_email_lowercase/);
  });
});

describe('the demo seed', () => {
  it('creates the demo workspace with the four accounts once, and they sign in with the demo password', async () => {
    const firstRun = await seedDemo(t.sequelize);
    expect(firstRun[0]).toBe('0001-demo-club');
    expect(firstRun).toEqual([...firstRun].sort());
    expect(await seedDemo(t.sequelize)).toEqual([]);

    const workspaces = await Workspace.findAll({ where: { name: DEMO_WORKSPACE_NAME } });
    expect(workspaces).toHaveLength(1);
    const members = await Membership.findAll({
      where: { workspaceId: workspaces[0].id },
      include: [{ model: User, as: 'user' }],
    });
    expect(Object.fromEntries(members.map((m) => [m.user!.email, m.role]))).toEqual({
      'owner@demo.example': 'owner',
      'editor@demo.example': 'editor',
      'reviewer@demo.example': 'reviewer',
      'viewer@demo.example': 'viewer',
    });

    for (const account of DEMO_ACCOUNTS) {
      const signIn = await request(t.app)
        .post('/api/auth/sign-in')
        .send({ email: account.email, password: DEMO_PASSWORD })
        .expect(200);
      const me = await request(t.app)
        .get('/api/me')
        .set('Authorization', `Bearer ${signIn.body.data.token}`)
        .expect(200);
      expect(me.body.data.workspaces).toEqual([
        { id: workspaces[0].id, name: DEMO_WORKSPACE_NAME, role: account.role },
      ]);
    }
  });
});
