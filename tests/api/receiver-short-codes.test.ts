import { QueryTypes } from 'sequelize';
import { beforeAll, describe, expect, it } from 'vitest';
import * as shortCodes from '@api/migrations/0060-receiver-short-codes';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { useTestApp } from './helpers/test-app';
import { clientFor, type Client } from './models-support';

// The short code on a unit's label: given by the database on every insert, unique in
// the workspace, found by the shelf's search however it is typed, and given to the
// units that were already on a shelf when the migration ran.

const t = useTestApp();
const CODE = /^[2-9A-HJKMNP-TW-Z]{6}$/;
let roles: RoleFixture;
let editor: Client;
const shelf = () => `/api/workspaces/${roles.workspace.id}/receivers`;

async function addUnit(label: string): Promise<{ id: string; short_code: string }> {
  const response = await editor.post(shelf(), { label, outputs: 8 }).expect(201);
  return response.body.data as { id: string; short_code: string };
}

beforeAll(async () => {
  roles = await createRoleFixture();
  editor = clientFor(t.app, t.config, roles.members.editor);
});

describe('receiver short codes', () => {
  it('gives each new unit six characters without look-alikes, different from every other unit’s', async () => {
    const units = await Promise.all(Array.from({ length: 25 }, (_, n) => addUnit(`Coded unit ${n}`)));
    for (const unit of units) expect(unit.short_code).toMatch(CODE);
    expect(new Set(units.map((unit) => unit.short_code)).size).toBe(units.length);
    const read = await editor.get(`/api/receivers/${units[0].id}`).expect(200);
    expect(read.body.data.short_code).toBe(units[0].short_code);
  });

  it('is found by the shelf’s search in upper or lower case, with a space or a dash in the middle', async () => {
    const unit = await addUnit('Searched by code');
    const code = unit.short_code;
    for (const typed of [
      code,
      code.toLowerCase(),
      `${code.slice(0, 3)} ${code.slice(3)}`,
      `${code.slice(0, 3)}-${code.slice(3)}`,
    ]) {
      const response = await editor.get(`${shelf()}?q=${encodeURIComponent(typed)}`).expect(200);
      expect(response.body.data.map((found: { id: string }) => found.id)).toEqual([unit.id]);
    }
  });

  it('is unique within a workspace, and the same code may stand in another workspace', async () => {
    const first = await addUnit('First holder');
    const second = await addUnit('Would-be twin');
    await expect(
      t.sequelize.query('UPDATE receivers SET short_code = $1 WHERE id = $2', { bind: [first.short_code, second.id] }),
    ).rejects.toMatchObject({
      name: 'SequelizeUniqueConstraintError',
      parent: { constraint: 'receivers_workspace_short_code' },
    });
    const other = await createRoleFixture();
    const otherEditor = clientFor(t.app, t.config, other.members.editor);
    const elsewhere = await otherEditor
      .post(`/api/workspaces/${other.workspace.id}/receivers`, { label: 'Elsewhere', outputs: 8 })
      .expect(201);
    await t.sequelize.query('UPDATE receivers SET short_code = $1 WHERE id = $2', {
      bind: [first.short_code, elsewhere.body.data.id],
    });
  });

  it('refuses a code outside the alphabet, even by direct SQL', async () => {
    const unit = await addUnit('Bad code');
    await expect(
      t.sequelize.query(`UPDATE receivers SET short_code = 'OIL0U1' WHERE id = $1`, { bind: [unit.id] }),
    ).rejects.toThrow(/check constraint/);
  });

  it('gives the units already on a shelf a code when the migration runs', async () => {
    const context = { queryInterface: t.sequelize.getQueryInterface(), sequelize: t.sequelize };
    await shortCodes.down({ name: '0060-receiver-short-codes', context });
    const [creator] = await t.sequelize.query<{ id: string }>('SELECT id FROM users LIMIT 1', {
      type: QueryTypes.SELECT,
    });
    await t.sequelize.query(
      `INSERT INTO receivers (workspace_id, label, outputs, created_by)
       SELECT $1, 'Older unit ' || n, 8, $2 FROM generate_series(1, 40) AS n`,
      { bind: [roles.workspace.id, creator.id] },
    );
    await shortCodes.up({ name: '0060-receiver-short-codes', context });
    const rows = await t.sequelize.query<{ short_code: string }>(
      'SELECT short_code FROM receivers WHERE workspace_id = $1',
      { bind: [roles.workspace.id], type: QueryTypes.SELECT },
    );
    expect(rows.length).toBeGreaterThan(40);
    for (const row of rows) expect(row.short_code).toMatch(CODE);
    expect(new Set(rows.map((row) => row.short_code)).size).toBe(rows.length);
    // The trigger is back: the next unit gets one too.
    expect((await addUnit('After the backfill')).short_code).toMatch(CODE);
  });
});
