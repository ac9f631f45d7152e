import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { NotFound } from '../errors';
import type { Revision, SetupModel } from '../models';

/** The model row as the save path needs it; a full SetupModel when the caller has one. */
export type LockedModelRow = Pick<SetupModel, 'id' | 'workspaceId' | 'airframe'> &
  Partial<Pick<SetupModel, 'name' | 'set'>>;

export interface LockedModel {
  model: LockedModelRow;
  /** `modelName` is the latest revision's own `model.name`, read when the lock is taken. */
  latest: (Pick<Revision, 'id' | 'number'> & { modelName?: string | null }) | null;
}

/**
 * Locks the model's row (SELECT ... FOR UPDATE) for the rest of the transaction, then
 * reads its latest revision. Every write to a model's history goes through this lock,
 * so concurrent saves on one base queue up and all but the first find their base
 * stale. The latest revision is read by a second statement on purpose: one that
 * waited for the lock must see the revision its predecessor committed, and in READ
 * COMMITTED only a new statement does (a join in the locking statement would keep
 * the rows it saw before the wait).
 */
export async function lockModel(sequelize: Sequelize, modelId: string, transaction: Transaction): Promise<LockedModel> {
  const [row] = await sequelize.query<{ id: string; workspace_id: string; airframe: string | null; name: string }>(
    'SELECT id, workspace_id, airframe, name FROM models WHERE id = $id FOR UPDATE',
    { bind: { id: modelId }, type: QueryTypes.SELECT, transaction },
  );
  if (!row) throw new NotFound('No such model.', { code: 'model-not-found' });
  const [latest] = await sequelize.query<{ id: string; number: number; model_name: string | null }>(
    `SELECT id, number, document->'model'->>'name' AS model_name
       FROM revisions WHERE model_id = $id ORDER BY number DESC LIMIT 1`,
    {
      bind: { id: modelId },
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  return {
    model: { id: row.id, workspaceId: row.workspace_id, airframe: row.airframe, name: row.name },
    latest: latest ? { id: latest.id, number: latest.number, modelName: latest.model_name } : null,
  };
}
