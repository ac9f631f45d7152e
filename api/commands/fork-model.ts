import type { Sequelize, Transaction } from 'sequelize';
import type { Revision, SetupModel, User, Workspace } from '../models';
import { insertModelWithFirstRevision, type CreatedModel } from './create-model';
import { recordAuditEvent } from '../audit/record-audit-event';
import { inTransaction } from '../db/transaction';
import { checkSetupText } from '../revisions/check-setup';

export interface ForkInput {
  source: { model: SetupModel; revision: Revision };
  workspace: Workspace;
  author: User;
  name?: string;
  message?: string;
  createdAt?: Date;
  transaction?: Transaction;
}

export const defaultForkName = (sourceName: string): string => {
  const suffix = ' (fork)';
  return `${sourceName.slice(0, 80 - suffix.length)}${suffix}`;
};

/**
 * A new model whose revision 1 is the source revision's exact text. The lineage is
 * kept twice over: the model's `forked_from_revision_id` and revision 1's
 * `source_revision_id` both name the source revision.
 */
export async function forkModel(sequelize: Sequelize, input: ForkInput): Promise<CreatedModel> {
  const { model: sourceModel, revision: sourceRevision } = input.source;
  const setup = checkSetupText(sourceRevision.yamlText);
  const name = input.name ?? defaultForkName(sourceModel.name);
  const message =
    input.message && input.message.length > 0
      ? input.message
      : `Forked from ${sourceModel.name}, revision ${sourceRevision.number}`;
  return inTransaction(sequelize, input.transaction, async (transaction) => {
    const created = await insertModelWithFirstRevision(
      sequelize,
      {
        workspace: input.workspace,
        author: input.author,
        name,
        setup,
        message,
        origin: 'fork',
        sourceRevision,
        createdAt: input.createdAt,
      },
      transaction,
    );
    const details = {
      name,
      revision_id: created.revision.id,
      source_model_id: sourceModel.id,
      source_revision_id: sourceRevision.id,
      source_number: sourceRevision.number,
      source_workspace_id: sourceModel.workspaceId,
    };
    await recordAuditEvent(
      {
        workspaceId: input.workspace.id,
        actor: input.author,
        action: 'model.forked',
        subjectType: 'model',
        subjectId: created.model.id,
        details,
        createdAt: input.createdAt,
      },
      transaction,
    );
    return created;
  });
}
