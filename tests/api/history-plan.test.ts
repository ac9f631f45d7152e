import { QueryTypes } from 'sequelize';
import { beforeAll, describe, expect, it } from 'vitest';
import { createRoleFixture, type RoleFixture } from './helpers/factories';
import { useTestApp } from './helpers/test-app';
import { clientFor, createModelVia, TRAINER, type Client } from './models-support';

// The history page must stay an index walk however long the history grows. The test
// fills the table with enough rows (30,000 in three models, then ANALYZE) that the
// planner's choice is real, captures the exact SQL the route runs, and reads its plan.
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

async function planOfHistoryPage(url: string): Promise<PlanNode> {
  const statements: string[] = [];
  // Sequelize reads its `logging` option on every query; its typings leave `options` out.
  const options = (t.sequelize as unknown as { options: { logging: unknown } }).options;
  const logging = options.logging;
  options.logging = (sql: string) => void statements.push(sql);
  try {
    await editor.get(url).expect(200);
  } finally {
    options.logging = logging;
  }
  const history = statements
    .map((line) => line.replace(/^Executing \([^)]*\): /, ''))
    .find((sql) => /FROM "revisions"/.test(sql) && /ORDER BY/.test(sql));
  expect(history, statements.join('\n')).toBeDefined();
  const [row] = await t.sequelize.query<{ 'QUERY PLAN': [{ Plan: PlanNode }] }>(`EXPLAIN (FORMAT JSON) ${history}`, {
    type: QueryTypes.SELECT,
  });
  return row['QUERY PLAN'][0].Plan;
}

describe('the history page of a model with 10,000 revisions', () => {
  for (const [label, query] of [
    ['the first page', '?limit=50'],
    ['a page further back (keyset: before=5000)', '?limit=50&before=5000'],
  ] as const) {
    it(`${label} reads revisions through an index, never a sequential scan`, async () => {
      const nodes = nodesOf(await planOfHistoryPage(`/api/models/${modelId}/revisions${query}`));
      const onRevisions = nodes.filter((node) => node['Relation Name'] === 'revisions');
      expect(onRevisions.length).toBeGreaterThan(0);
      for (const node of onRevisions) expect(node['Node Type']).not.toBe('Seq Scan');
      expect(onRevisions.some((node) => /Index/.test(node['Node Type']))).toBe(true);
    });
  }
});
