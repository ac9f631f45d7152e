import { literal, QueryTypes, type Sequelize } from 'sequelize';
import { BadRequest } from '../errors';

// Keyset paging for lists ordered by (lower(<column>), id), the order of their
// indexes (migration 0032): a page that starts after a given row is an index range
// read, however deep into the list it is, where an offset makes the database walk and
// throw away every row before it.
const LISTS = {
  models: { alias: 'SetupModel', column: 'name', noun: 'model' },
  receivers: { alias: 'Receiver', column: 'label', noun: 'receiver' },
} as const;

export type KeysetList = keyof typeof LISTS;

/**
 * The WHERE condition of the page after the row `afterId` of the workspace's list;
 * 400 when that row is not in the workspace (a cursor from another list, or gone).
 */
export async function afterRow(
  sequelize: Sequelize,
  list: KeysetList,
  workspaceId: string,
  afterId: string,
): Promise<ReturnType<typeof literal>> {
  const { alias, column, noun } = LISTS[list];
  const found = await sequelize.query(`SELECT 1 FROM ${list} WHERE id = $id AND workspace_id = $workspaceId`, {
    bind: { id: afterId, workspaceId },
    type: QueryTypes.SELECT,
  });
  if (found.length === 0)
    throw new BadRequest(`after names no ${noun} of this workspace.`, {
      code: 'invalid-input',
      details: { fields: { after: `after is the id of the last ${noun} of the page before.` } },
    });
  const id = sequelize.escape(afterId);
  return literal(
    `(lower("${alias}"."${column}"), "${alias}"."id") > (SELECT lower(${column}), id FROM ${list} WHERE id = ${id})`,
  );
}
