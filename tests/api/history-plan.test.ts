import pg from 'pg';
import { QueryTypes } from 'sequelize';
import { beforeAll, describe, expect, it } from 'vitest';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { useTestApp } from './helpers/test-app';
import { clientFor, createModelVia, edit, saveVia, TRAINER, type Client } from './models-support';

// The history page must stay an index walk however long the history grows, and so must
// the hangar, the shelf and the compare as the workspace grows. The test fills the
// tables with enough rows (30,000 revisions in three models; 12,000 models and 8,000
// receivers in four workspaces; then ANALYZE) that the planner's choice is real,
// captures the exact SQL each route runs, and reads its plan.
const t = useTestApp();
let roles: RoleFixture;
let editor: Client;
let modelId: string;

interface PlanNode {
  'Node Type': string;
  'Relation Name'?: string;
  Plans?: PlanNode[];
}

const nodesOf = (node: PlanNode): PlanNode[] => [node, ...(node.Plans ?? []).flatMap(nodesOf)];

beforeAll(async () => {
  roles = await createRoleFixture();
  editor = clientFor(t.app, t.config, roles.members.editor);
  const ids: string[] = [];
  for (const name of ['Long history', 'Neighbour one', 'Neighbour two'])
    ids.push((await createModelVia(editor, roles.workspace.id, { name, yaml: TRAINER() })).model.id);
  modelId = ids[0];
  // Copies of revision 1 as revisions 2..10,000 of each model, straight in SQL, each
  // the parent of the next (ids derived from model and number so a row can name its parent).
  await t.sequelize.query(
    `INSERT INTO revisions (id, model_id, number, parent_id, author_id, message, yaml_text, document, content_hash, origin)
     SELECT md5(r.model_id::text || n)::uuid, r.model_id, n,
            CASE WHEN n = 2 THEN r.id ELSE md5(r.model_id::text || (n - 1))::uuid END,
            r.author_id, 'bulk ' || n, r.yaml_text, r.document, r.content_hash, 'save'
       FROM revisions r, generate_series(2, 10000) AS n
      WHERE r.model_id = ANY($ids::uuid[]) AND r.number = 1
      ORDER BY r.model_id, n`,
    { bind: { ids } },
  );
  await t.sequelize.query('ANALYZE revisions');
}, 120_000);

interface Statement {
  sql: string;
  /** The values of $1, $2 ... when the statement has bound parameters. */
  bind?: unknown[];
}

/** The SQL statements a request runs with their parameters, as the pg driver sends them. */
async function statementsOf(url: string): Promise<Statement[]> {
  const statements: Statement[] = [];
  // Sequelize hands every statement to pg.Client#query, with $1, $2 ... already numbered;
  // runPrepared (api/db/prepared.ts) hands it a named statement's text and values.
  const prototype = pg.Client.prototype as unknown as { query: (...args: unknown[]) => unknown };
  const query = prototype.query;
  prototype.query = function (this: unknown, ...args: unknown[]) {
    const [first, second] = args as [unknown, unknown];
    if (typeof first === 'string')
      statements.push({ sql: first, bind: Array.isArray(second) ? (second as unknown[]) : undefined });
    else if (first && typeof first === 'object' && 'text' in first && typeof first.text === 'string')
      statements.push({ sql: first.text, bind: 'values' in first ? (first.values as unknown[]) : undefined });
    return query.apply(this, args);
  };
  try {
    await editor.get(url).expect(200);
  } finally {
    prototype.query = query;
  }
  return statements;
}

async function planOf({ sql, bind }: Statement): Promise<PlanNode> {
  const [row] = await t.sequelize.query<{ 'QUERY PLAN': [{ Plan: PlanNode }] }>(`EXPLAIN (FORMAT JSON) ${sql}`, {
    type: QueryTypes.SELECT,
    bind,
  });
  return row['QUERY PLAN'][0].Plan;
}

/** Every node that reads `relation` is an index read, and there is at least one. */
function expectIndexReads(plan: PlanNode, relation: string): void {
  const reads = nodesOf(plan).filter((node) => node['Relation Name'] === relation);
  expect(reads.length, relation).toBeGreaterThan(0);
  const shown = JSON.stringify(plan, ['Node Type', 'Relation Name', 'Index Name', 'Plans']);
  for (const node of reads) expect(node['Node Type'], shown).not.toBe('Seq Scan');
  expect(
    // A bitmap heap scan reads the rows its bitmap index scans found (a search's filter may pick that).
    reads.some((node) => /Index|Bitmap Heap/.test(node['Node Type'])),
    shown,
  ).toBe(true);
}

async function planOfHistoryPage(url: string): Promise<PlanNode> {
  const statements = await statementsOf(url);
  const history = statements.find(({ sql }) => /FROM "revisions"/.test(sql) && /ORDER BY/.test(sql));
  expect(history, statements.map(({ sql }) => sql).join('\n')).toBeDefined();
  return planOf(history!);
}

describe('the history page of a model with 10,000 revisions', () => {
  for (const [label, query] of [
    ['the first page', '?limit=50'],
    ['a page further back (keyset: before=5000)', '?limit=50&before=5000'],
  ] as const) {
    it(`${label} reads revisions through an index, never a sequential scan`, async () => {
      expectIndexReads(await planOfHistoryPage(`/api/models/${modelId}/revisions${query}`), 'revisions');
    });
  }
});

describe('a hangar of 3,000 models and a shelf of 2,000 receivers among four workspaces', () => {
  beforeAll(async () => {
    // Three more workspaces of the same size around the editor's, so a sequential scan
    // would read four times what the page needs.
    await t.sequelize.query(
      `WITH made AS (
         INSERT INTO workspaces (name) SELECT 'Neighbour ' || k FROM generate_series(1, 3) AS k RETURNING id
       ), spaces AS (
         SELECT $workspaceId::uuid AS id UNION ALL SELECT id FROM made
       ), made_models AS (
         INSERT INTO models (workspace_id, name, airframe, created_by)
         SELECT spaces.id, 'Plan model ' || n, 'airplane', $authorId FROM spaces, generate_series(1, 3000) AS n
       )
       INSERT INTO receivers (workspace_id, label, outputs, created_by)
       SELECT spaces.id, 'Plan unit ' || n, 8, $authorId
         FROM spaces, generate_series(1, 2000) AS n`,
      { bind: { workspaceId: roles.workspace.id, authorId: roles.members.editor.id } },
    );
    await t.sequelize.query('ANALYZE workspaces; ANALYZE models; ANALYZE receivers; ANALYZE memberships');
  }, 120_000);

  // The id of the model and the receiver 1,500 entries into the lists, for keyset paging.
  const cursor = async (table: 'models' | 'receivers', column: 'name' | 'label') => {
    const [row] = await t.sequelize.query<{ id: string }>(
      `SELECT id FROM ${table} WHERE workspace_id = $id ORDER BY lower(${column}), id OFFSET 1499 LIMIT 1`,
      { bind: { id: roles.workspace.id }, type: QueryTypes.SELECT },
    );
    return row.id;
  };

  for (const [label, query] of [
    ['the first page', async () => '?limit=50'],
    [
      'a page 1,500 entries on (keyset: after=)',
      async (list: 'models' | 'receivers') =>
        `?limit=50&after=${await cursor(list, list === 'models' ? 'name' : 'label')}`,
    ],
    // The screens' search box asks the server, so a search is a page of the same index walk.
    [
      'search (q=)',
      async (list: 'models' | 'receivers') => `?limit=50&q=${list === 'models' ? 'model 29' : 'unit 19'}`,
    ],
  ] as const) {
    it(`the hangar's ${label} reads models through an index`, async () => {
      const statements = await statementsOf(`/api/workspaces/${roles.workspace.id}/models${await query('models')}`);
      const page = statements.find(({ sql }) => /FROM "models"/.test(sql) && /ORDER BY lower\("name"\)/.test(sql));
      expect(page, statements.map(({ sql }) => sql).join('\n')).toBeDefined();
      const plan = await planOf(page!);
      expectIndexReads(plan, 'models');
      // A search also matches each model's latest author, read by index model by model.
      if (label.startsWith('search')) expectIndexReads(plan, 'revisions');
    });

    it(`the shelf's ${label} reads receivers through an index`, async () => {
      const statements = await statementsOf(
        `/api/workspaces/${roles.workspace.id}/receivers${await query('receivers')}`,
      );
      const page = statements.find(({ sql }) => /FROM "receivers"/.test(sql) && /ORDER BY lower\("label"\)/.test(sql));
      expect(page, statements.map(({ sql }) => sql).join('\n')).toBeDefined();
      expectIndexReads(await planOf(page!), 'receivers');
    });
  }

  for (const list of ['models', 'receivers'] as const) {
    it(`paging the ${list} with after= gives every entry once, in the order of offset paging`, async () => {
      const base = `/api/workspaces/${roles.workspace.id}/${list}`;
      const walked: string[] = [];
      let after: string | null = null;
      do {
        const page: { data: { id: string }[]; pagination: { next_after: string | null; total: number } } = (
          await editor.get(`${base}?limit=200${after ? `&after=${after}` : ''}`).expect(200)
        ).body;
        walked.push(...page.data.map((entry) => entry.id));
        after = page.pagination.next_after;
      } while (after);
      const [{ total }] = await t.sequelize.query<{ total: number }>(
        `SELECT count(*)::int AS total FROM ${list} WHERE workspace_id = $id`,
        { bind: { id: roles.workspace.id }, type: QueryTypes.SELECT },
      );
      expect(walked.length).toBe(total);
      expect(new Set(walked).size).toBe(total);
      const byOffset = (await editor.get(`${base}?limit=50&offset=1000`).expect(200)).body.data.map(
        (entry: { id: string }) => entry.id,
      );
      expect(walked.slice(1000, 1050)).toEqual(byOffset);
      // A cursor from another workspace's list is refused, not silently an empty page.
      const [foreign] = await t.sequelize.query<{ id: string }>(
        `SELECT id FROM ${list} WHERE workspace_id <> $id LIMIT 1`,
        { bind: { id: roles.workspace.id }, type: QueryTypes.SELECT },
      );
      const refused = await editor.get(`${base}?after=${foreign.id}`).expect(400);
      expect(refused.body.error.details.fields).toHaveProperty('after');
    });
  }

  it('the compare of two revisions of the long history reads revisions and models through an index', async () => {
    const [first] = await t.sequelize.query<{ id: string }>(
      'SELECT id FROM revisions WHERE model_id = $id AND number = 1',
      { bind: { id: modelId }, type: QueryTypes.SELECT },
    );
    const last = await saveVia(editor, modelId, 10000, edit(TRAINER(), 'expo: 30,', 'expo: 44,'));
    const statements = await statementsOf(`/api/compare?from=${first.id}&to=${last.id}`);
    // The compare's sides (with the cache row and the club's rules) in one statement,
    // then, the cache being cold, the two documents.
    const sides = statements.find(({ sql }) => /FROM \(VALUES/.test(sql) && /compare_cache/.test(sql));
    const documents = statements.find(({ sql }) => /SELECT id, document FROM revisions/.test(sql));
    expect(sides, statements.map(({ sql }) => sql).join('\n')).toBeDefined();
    expect(documents, statements.map(({ sql }) => sql).join('\n')).toBeDefined();
    const plan = await planOf(sides!);
    // The tables that grow with the data (revisions, models) are read by index; small
    // ones (a workspace's memberships, an empty cache) may rightly be scanned.
    expectIndexReads(plan, 'revisions');
    expectIndexReads(plan, 'models');
    const relations = new Set(nodesOf(plan).map((node) => node['Relation Name']));
    for (const relation of ['memberships', 'users', 'tags', 'compare_cache', 'club_rules'])
      expect(relations, relation).toContain(relation);
    expectIndexReads(await planOf(documents!), 'revisions');
    // A warm compare reads that one statement after the session check, no documents and
    // no cache write (the save's provenance recording may still be running alongside).
    const warm = (await statementsOf(`/api/compare?from=${first.id}&to=${last.id}`)).map(({ sql }) => sql);
    expect(warm.filter((sql) => sql === sides!.sql)).toHaveLength(1);
    expect(warm.filter((sql) => sql === documents!.sql || (/compare_cache/.test(sql) && sql !== sides!.sql))).toEqual(
      [],
    );
  });
});
