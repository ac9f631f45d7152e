import type { Sequelize, Transaction } from 'sequelize';
import { isMap, parseDocument } from 'yaml';
import { applyEdits } from '@shared/edit/document-edits';
import { recordAuditEvent } from '../audit/record-audit-event';
import { Revision, type SetupModel, type User } from '../models';
import { appendRevision } from '../revisions/append-revision';
import { checkSetupText } from '../revisions/check-setup';
import { lockModel } from '../revisions/lock-model';

/** The latest text with `model.name` set to `name`, or null when the text has no `model` mapping to hold it. */
function renamedText(text: string, name: string): string | null {
  const doc = parseDocument(text);
  if (doc.errors.length > 0 || !isMap(doc.get('model', true))) return null;
  return applyEdits(text, [{ kind: 'set', path: ['model', 'name'], value: name }]);
}

/**
 * Renames a model and keeps the setup's own `model.name` in step: the latest text with
 * the new name is saved as the next revision (a one-line change that the history, the
 * compare and a review all show), and the record follows it, audited as
 * `model.renamed`. A latest text without a `model` mapping is left as it is and only
 * the record is renamed.
 */
export async function renameModel(
  sequelize: Sequelize,
  model: SetupModel,
  name: string,
  actor: User,
): Promise<{ model: SetupModel; revision: Revision | null }> {
  return sequelize.transaction(async (transaction) => {
    const locked = await lockModel(sequelize, model.id, transaction);
    const previous = locked.model.name ?? model.name;
    const latest = locked.latest
      ? await Revision.findByPk(locked.latest.id, { attributes: ['id', 'yamlText'], transaction })
      : null;
    const text = latest ? renamedText(latest.yamlText, name) : null;
    if (text !== null && text !== latest?.yamlText) {
      const revision = await appendRevision(
        sequelize,
        { ...locked, model },
        checkSetupText(text),
        {
          author: actor,
          message:
            previous === name
              ? `Wrote the model's name “${name}” into model.name`
              : `Renamed the model from “${previous}” to “${name}”`,
          origin: 'save',
          audit: { action: 'revision.saved', details: { renamed: { from: previous, to: name } } },
          followName: true,
        },
        transaction,
      );
      // The record had drifted from the text, so the save did not move it: it follows here.
      if (model.name !== name) await renameRecord(model, previous, name, actor, transaction, revision.number);
      return { model, revision };
    }
    if (previous !== name) await renameRecord(model, previous, name, actor, transaction);
    return { model, revision: null };
  });
}

async function renameRecord(
  model: SetupModel,
  from: string,
  to: string,
  actor: User,
  transaction: Transaction,
  number?: number,
): Promise<void> {
  await model.update({ name: to }, { transaction });
  await recordAuditEvent(
    {
      workspaceId: model.workspaceId,
      actor,
      action: 'model.renamed',
      subjectType: 'model',
      subjectId: model.id,
      details: number === undefined ? { from, to } : { from, to, number },
    },
    transaction,
  );
}
