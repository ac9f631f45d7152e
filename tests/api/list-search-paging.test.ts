import { QueryTypes } from 'sequelize';
import { beforeAll, describe, expect, it } from 'vitest';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { useTestApp } from './helpers/test-app';
import { clientFor, type Client } from './models-support';

// What the hangar and the shelf screens rely on: a page holds at most what was asked, the
// next page follows from the cursor the last one gave (next_after), and the search runs
// on the server, so an entry far past the first page is still found by it.
const t = useTestApp();
let roles: RoleFixture;
let viewer: Client;

interface ListPage {
  data: { id: string; name?: string; label?: string; short_code?: string }[];
  pagination: { limit: number; total: number; next_after: string | null };
}

const pad = (n: number) => String(n).padStart(3, '0');

beforeAll(async () => {
  roles = await createRoleFixture();
  viewer = clientFor(t.app, t.config, roles.members.viewer);
  // 130 models and 130 receivers in the workspace, plus one of each named to sort last;
  // the other workspace holds a model and a unit of the same name, which no search here may see.
  const bind = {
    workspaceId: roles.workspace.id,
    otherId: roles.otherWorkspace.id,
    authorId: roles.members.editor.id,
    outsiderId: roles.outsider.id,
  };
  for (const sql of [
    `INSERT INTO models (workspace_id, name, airframe, created_by)
     SELECT $workspaceId, 'Hangar ' || lpad(n::text, 3, '0'), 'airplane', $authorId FROM generate_series(1, 130) AS n`,
    `INSERT INTO models (workspace_id, name, airframe, created_by) VALUES
       ($workspaceId, 'Zephyr Far Down', 'glider', $authorId), ($otherId, 'Zephyr Far Down', 'glider', $outsiderId)`,
    `INSERT INTO receivers (workspace_id, label, outputs, created_by)
     SELECT $workspaceId, 'Shelf unit ' || lpad(n::text, 3, '0'), 8, $authorId FROM generate_series(1, 130) AS n`,
    `INSERT INTO receivers (workspace_id, label, outputs, created_by) VALUES
       ($workspaceId, 'Zulu spare', 6, $authorId), ($otherId, 'Zulu spare', 6, $outsiderId)`,
  ])
    await t.sequelize.query(sql, { bind });
});

const listOf = {
  models: () => `/api/workspaces/${roles.workspace.id}/models`,
  receivers: () => `/api/workspaces/${roles.workspace.id}/receivers`,
};

async function pageOf(list: keyof typeof listOf, query: string): Promise<ListPage> {
  return (await viewer.get(`${listOf[list]()}?${query}`).expect(200)).body as ListPage;
}

const namesOf = (page: ListPage) => page.data.map((entry) => entry.name ?? entry.label);

describe.each([
  ['models', 'Hangar', 'Zephyr Far Down'],
  ['receivers', 'Shelf unit', 'Zulu spare'],
] as const)('the %s list', (list, prefix, last) => {
  it('answers a page no longer than asked, and the next page follows from its cursor', async () => {
    const first = await pageOf(list, 'limit=50');
    expect(first.data).toHaveLength(50);
    expect(first.pagination.total).toBe(131);
    expect(namesOf(first)[0]).toBe(`${prefix} 001`);
    expect(first.pagination.next_after).toBe(first.data[49].id);

    const second = await pageOf(list, `limit=50&after=${first.pagination.next_after}`);
    expect(namesOf(second)).toEqual(Array.from({ length: 50 }, (_, n) => `${prefix} ${pad(n + 51)}`));
    const third = await pageOf(list, `limit=50&after=${second.pagination.next_after}`);
    expect(third.data).toHaveLength(31);
    expect(namesOf(third).at(-1)).toBe(last);
    expect(third.pagination.next_after).toBeNull();
  });

  it('finds by search an entry far past the first page, in this workspace only', async () => {
    const found = await pageOf(list, `limit=50&q=${encodeURIComponent(last.split(' ')[0].toLowerCase())}`);
    expect(namesOf(found)).toEqual([last]);
    expect(found.pagination).toMatchObject({ total: 1, next_after: null });
  });

  it('pages a search by its cursor too, with the search’s own total', async () => {
    const q = encodeURIComponent(`${prefix} 1`);
    const first = await pageOf(list, `limit=20&q=${q}`);
    // 100 to 130.
    expect(first.pagination.total).toBe(31);
    expect(first.data).toHaveLength(20);
    const rest = await pageOf(list, `limit=20&q=${q}&after=${first.pagination.next_after}`);
    expect([...namesOf(first), ...namesOf(rest)]).toEqual(Array.from({ length: 31 }, (_, n) => `${prefix} ${n + 100}`));
    expect(rest.pagination.next_after).toBeNull();
  });
});

it('finds the models a clubmate last changed by that clubmate’s name, far down the hangar too', async () => {
  // Hangar 118 was last saved by the owner; Hangar 121 by the owner first, then by the editor.
  await t.sequelize.query(
    `INSERT INTO revisions (model_id, number, parent_id, author_id, yaml_text, document, content_hash)
     SELECT m.id, 1, NULL, $ownerId, 'model: {}', '{}', md5(m.name) || md5(m.name)
       FROM models m WHERE m.workspace_id = $workspaceId AND m.name IN ('Hangar 118', 'Hangar 121')`,
    { bind: { workspaceId: roles.workspace.id, ownerId: roles.members.owner.id } },
  );
  await t.sequelize.query(
    `INSERT INTO revisions (model_id, number, parent_id, author_id, yaml_text, document, content_hash)
     SELECT r.model_id, 2, r.id, $editorId, 'model: {}', '{}', md5(r.id::text) || md5(r.id::text)
       FROM revisions r JOIN models m ON m.id = r.model_id
      WHERE m.workspace_id = $workspaceId AND m.name = 'Hangar 121'`,
    { bind: { workspaceId: roles.workspace.id, editorId: roles.members.editor.id } },
  );
  const byOwner = await pageOf('models', `limit=50&q=${encodeURIComponent(roles.members.owner.name.toUpperCase())}`);
  expect(namesOf(byOwner)).toEqual(['Hangar 118']);
  expect(byOwner.pagination).toMatchObject({ total: 1, next_after: null });
  // The models the editor created but never saved are not theirs by this search.
  expect(namesOf(await pageOf('models', `q=${encodeURIComponent(roles.members.editor.name)}`))).toEqual(['Hangar 121']);
  expect(namesOf(await pageOf('models', 'q=the%20'))).toEqual(['Hangar 118', 'Hangar 121']);
});

it('finds a unit far down the shelf by the short code on its label', async () => {
  const [unit] = await t.sequelize.query<{ short_code: string }>(
    `SELECT short_code FROM receivers WHERE workspace_id = $id AND label = 'Shelf unit 127'`,
    { bind: { id: roles.workspace.id }, type: QueryTypes.SELECT },
  );
  const typed = `${unit.short_code.slice(0, 3).toLowerCase()}-${unit.short_code.slice(3)}`;
  const found = await pageOf('receivers', `limit=50&q=${typed}`);
  expect(namesOf(found)).toEqual(['Shelf unit 127']);
});

it('refuses a page larger than the largest, with the reason', async () => {
  const refused = await viewer.get(`${listOf.models()}?limit=5000`).expect(400);
  expect(refused.body.error.details.fields.limit).toBe('limit is at most 200.');
});
