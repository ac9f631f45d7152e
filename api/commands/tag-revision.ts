import type { Sequelize, Transaction } from 'sequelize';
import { Conflict, NotFound } from '../errors';
import { Revision, Tag, type SetupModel, type User } from '../models';
import { recordAuditEvent } from '../audit/record-audit-event';
import { inTransaction } from '../db/transaction';

export interface TagInput {
  model: SetupModel;
  revision: Revision;
  author: User;
  name: string;
  createdAt?: Date;
  transaction?: Transaction;
}

export const tagNamesOf = async (revisionId: string): Promise<string[]> =>
  (await Tag.findAll({ where: { revisionId }, attributes: ['name'], order: [['name', 'ASC']] })).map((tag) => tag.name);

/**
 * Puts a tag on a revision. A tag names one revision of a model: a name already on
 * another revision is refused (remove it there first); on this revision it is kept
 * as it is. Answers whether the tag is new.
 */
export async function tagRevision(sequelize: Sequelize, input: TagInput): Promise<{ created: boolean }> {
  return inTransaction(sequelize, input.transaction, async (transaction) => {
    const existing = await Tag.findOne({
      where: { modelId: input.model.id, name: input.name },
      include: [{ model: Revision, as: 'revision', attributes: ['id', 'number'] }],
      transaction,
    });
    if (existing) {
      if (existing.revisionId === input.revision.id) return { created: false };
      const number = existing.revision?.number;
      throw new Conflict(
        `The tag "${input.name}" is already on revision ${number} of this model; remove it there first.`,
        {
          code: 'tag-taken',
          details: { name: input.name, revision_id: existing.revisionId, number },
        },
      );
    }
    const tag = await Tag.create(
      {
        modelId: input.model.id,
        revisionId: input.revision.id,
        name: input.name,
        createdBy: input.author.id,
        ...(input.createdAt ? { createdAt: input.createdAt } : {}),
      },
      { transaction },
    );
    await recordAuditEvent(
      {
        workspaceId: input.model.workspaceId,
        actor: input.author,
        action: 'tag.added',
        subjectType: 'tag',
        subjectId: tag.id,
        details: {
          name: input.name,
          model_id: input.model.id,
          revision_id: input.revision.id,
          number: input.revision.number,
        },
        createdAt: input.createdAt,
      },
      transaction,
    );
    return { created: true };
  });
}

export async function untagRevision(sequelize: Sequelize, input: Omit<TagInput, 'createdAt'>): Promise<void> {
  await inTransaction(sequelize, input.transaction, async (transaction) => {
    const tag = await Tag.findOne({ where: { revisionId: input.revision.id, name: input.name }, transaction });
    if (!tag)
      throw new NotFound(`Revision ${input.revision.number} has no tag "${input.name}".`, { code: 'tag-not-found' });
    await tag.destroy({ transaction });
    await recordAuditEvent(
      {
        workspaceId: input.model.workspaceId,
        actor: input.author,
        action: 'tag.removed',
        subjectType: 'tag',
        subjectId: tag.id,
        details: {
          name: input.name,
          model_id: input.model.id,
          revision_id: input.revision.id,
          number: input.revision.number,
        },
      },
      transaction,
    );
  });
}
