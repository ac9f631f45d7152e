import type { Sequelize } from 'sequelize';
import { createModel } from '@api/commands/create-model';
import { saveRevision } from '@api/commands/save-revision';
import type { Revision, SetupModel, User, Workspace } from '@api/models';

// Large data for the scale benchmarks, written by single INSERT ... SELECT statements
// over generate_series (one round trip and one commit however many rows), copying one
// revision made the ordinary way so every row is what a save would have stored.

/** `count` more models in the workspace, each with one revision copied from a model of the demo setup. */
export async function seedHangar(
  sequelize: Sequelize,
  input: { workspace: Workspace; author: User; yaml: string; count: number },
): Promise<void> {
  const { revision } = await createModel(sequelize, {
    workspace: input.workspace,
    author: input.author,
    name: 'Hangar model 00000',
    yaml: input.yaml,
  });
  await sequelize.query(
    `WITH made AS (
       INSERT INTO models (workspace_id, name, airframe, created_by)
       SELECT $workspaceId, 'Hangar model ' || lpad(n::text, 5, '0'), 'airplane', $authorId
         FROM generate_series(1, $count::integer - 1) AS n
       RETURNING id
     )
     INSERT INTO revisions (model_id, number, author_id, message, yaml_text, document, content_hash, findings,
                            error_count, warning_count, info_count, origin)
     SELECT made.id, 1, first.author_id, first.message, first.yaml_text, first.document, first.content_hash,
            first.findings, first.error_count, first.warning_count, first.info_count, 'save'
       FROM made CROSS JOIN (SELECT * FROM revisions WHERE id = $first::uuid) AS first`,
    { bind: { workspaceId: input.workspace.id, authorId: input.author.id, count: input.count, first: revision.id } },
  );
  await sequelize.query('ANALYZE models; ANALYZE revisions');
}

/** `count` receivers on the workspace's shelf. */
export async function seedShelf(
  sequelize: Sequelize,
  input: { workspace: Workspace; author: User; count: number },
): Promise<void> {
  await sequelize.query(
    `INSERT INTO receivers (workspace_id, label, mark, outputs, notes, created_by)
     SELECT $workspaceId, 'Shelf unit ' || lpad(n::text, 4, '0'), 'Tape ' || (n % 7), 8, 'Bench unit', $authorId
       FROM generate_series(1, $count::integer) AS n`,
    { bind: { workspaceId: input.workspace.id, authorId: input.author.id, count: input.count } },
  );
  await sequelize.query('ANALYZE receivers');
}

/**
 * A model whose history has `count` revisions: revision 1 made the ordinary way, then
 * 2..count copies of it in one statement, each the parent of the next (so the sequence
 * trigger accepts them) and a second apart. `document`, an SQL expression over `first`
 * (revision 1's row) and `chained.n` (the number), varies the copies' documents; by
 * default they repeat revision 1's.
 */
export async function seedHistory(
  sequelize: Sequelize,
  input: { workspace: Workspace; author: User; yaml: string; count: number; name: string; document?: string },
): Promise<{ model: SetupModel; first: Revision }> {
  const { model, revision: first } = await createModel(sequelize, {
    workspace: input.workspace,
    author: input.author,
    name: input.name,
    yaml: input.yaml,
  });
  await sequelize.query(
    `WITH numbered AS (
       SELECT n, gen_random_uuid() AS id FROM generate_series(2, $count::integer) AS n
     ), chained AS (
       SELECT n, id, coalesce(lag(id) OVER (ORDER BY n), $first::uuid) AS parent_id FROM numbered
     )
     INSERT INTO revisions (id, model_id, number, parent_id, author_id, message, yaml_text, document, content_hash, findings,
                            error_count, warning_count, info_count, origin, created_at)
     SELECT chained.id, first.model_id, chained.n, chained.parent_id, first.author_id, 'Bench revision ' || chained.n,
            first.yaml_text, ${input.document ?? 'first.document'}, first.content_hash, first.findings, first.error_count,
            first.warning_count, first.info_count, 'save', first.created_at + chained.n * interval '1 second'
       FROM chained CROSS JOIN (SELECT * FROM revisions WHERE id = $first::uuid) AS first
      ORDER BY chained.n`,
    { bind: { count: input.count, first: first.id } },
  );
  await sequelize.query('ANALYZE revisions');
  return { model, first };
}

/**
 * seedHistory with `count` revisions, the last one saved the ordinary way with
 * `lastYaml`, so a compare of the first and the last revision has real changes to show.
 */
export async function seedLongHistory(
  sequelize: Sequelize,
  input: { workspace: Workspace; author: User; yaml: string; lastYaml: string; count: number; name: string },
): Promise<{ model: SetupModel; first: Revision; last: Revision }> {
  const { model, first } = await seedHistory(sequelize, { ...input, count: input.count - 1 });
  const last = await saveRevision(sequelize, {
    modelId: model.id,
    author: input.author,
    base: input.count - 1,
    yaml: input.lastYaml,
    message: 'The latest change',
  });
  return { model, first, last };
}
