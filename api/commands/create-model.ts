import type { Sequelize, Transaction } from 'sequelize';
import { Revision, SetupModel, type User, type Workspace } from '../models';
import { starterSetup, type Airframe } from '../starter-setup';
import { recordAuditEvent } from '../audit/record-audit-event';
import { inTransaction } from '../db/transaction';
import { appendRevision } from '../revisions/append-revision';
import { airframeOf, checkSetupDocument, type CheckedSetup } from '../revisions/check-setup';

export interface CreateModelInput {
  workspace: Workspace;
  author: User;
  name: string;
  /** The setup text as sent; the starter setup (named after the model) when absent. */
  yaml?: string;
  /** The setup already read and checked by the caller, instead of `yaml`. */
  setup?: CheckedSetup;
  message?: string;
  /** The starter setup's airframe kind; a given `yaml` names its own. */
  airframe?: Airframe;
  origin?: 'create' | 'upload';
  createdAt?: Date;
  transaction?: Transaction;
}

export interface CreatedModel {
  model: SetupModel;
  revision: Revision;
}

export interface FirstRevision {
  workspace: Workspace;
  author: User;
  name: string;
  setup: CheckedSetup;
  message: string;
  origin: 'create' | 'upload' | 'fork';
  sourceRevision?: Revision | null;
  createdAt?: Date;
}

/** A model and its revision 1, in the caller's transaction. */
export async function insertModelWithFirstRevision(
  sequelize: Sequelize,
  input: FirstRevision,
  transaction: Transaction,
): Promise<CreatedModel> {
  const timestamps = input.createdAt ? { createdAt: input.createdAt, updatedAt: input.createdAt } : {};
  const model = await SetupModel.create(
    {
      workspaceId: input.workspace.id,
      name: input.name,
      airframe: airframeOf(input.setup.analysis.data),
      forkedFromRevisionId: input.sourceRevision?.id ?? null,
      createdBy: input.author.id,
      ...timestamps,
    },
    { transaction, silent: Boolean(input.createdAt) },
  );
  const revision = await appendRevision(
    sequelize,
    { model, latest: null },
    input.setup,
    {
      author: input.author,
      message: input.message,
      origin: input.origin,
      sourceRevisionId: input.sourceRevision?.id ?? null,
      createdAt: input.createdAt,
    },
    transaction,
  );
  return { model, revision };
}

export function defaultFirstMessage(origin: 'create' | 'upload', hadYaml: boolean): string {
  if (origin === 'upload') return 'Uploaded from a file';
  return hadYaml ? 'First revision' : 'Started from the starter setup';
}

export async function createModel(sequelize: Sequelize, input: CreateModelInput): Promise<CreatedModel> {
  const origin = input.origin ?? 'create';
  const setup = input.setup ?? checkSetupDocument(input.yaml ?? starterSetup(input.name, input.airframe));
  const given = input.setup !== undefined || input.yaml !== undefined;
  const message = input.message && input.message.length > 0 ? input.message : defaultFirstMessage(origin, given);
  return inTransaction(sequelize, input.transaction, async (transaction) => {
    const created = await insertModelWithFirstRevision(
      sequelize,
      {
        workspace: input.workspace,
        author: input.author,
        name: input.name,
        setup,
        message,
        origin,
        createdAt: input.createdAt,
      },
      transaction,
    );
    await recordAuditEvent(
      {
        workspaceId: input.workspace.id,
        actor: input.author,
        action: 'model.created',
        subjectType: 'model',
        subjectId: created.model.id,
        details: {
          name: created.model.name,
          revision_id: created.revision.id,
          origin,
          content_hash: created.revision.contentHash,
        },
        createdAt: input.createdAt,
      },
      transaction,
    );
    return created;
  });
}
