import type { Sequelize, Transaction } from 'sequelize';
import { modelName } from '../model-fields';
import { insertModelWithFirstRevision } from '../commands/create-model';
import { recordAuditEvent } from '../audit/record-audit-event';
import { appendRevision } from '../revisions/append-revision';
import { checkSetupText, type CheckedSetup } from '../revisions/check-setup';
import type { LockedModel } from '../revisions/lock-model';
import { HttpError } from '../errors';
import { Tag, type SetupModel, type User, type Workspace } from '../models';
import type { ImportedModel, ReportProgress } from './import-history';

export interface ImportResult {
  model: SetupModel;
  revisions: number;
  tags: number;
  /** Revisions whose content hash differs from the one the export recorded. */
  hashMismatches: { number: number; recorded: string; computed: string }[];
}

function nameFor(imported: ImportedModel, setups: CheckedSetup[], override: string | undefined): string {
  const own = (setups[setups.length - 1].analysis.data as { model?: { name?: unknown } } | null)?.model?.name;
  for (const candidate of [
    override,
    imported.name,
    typeof own === 'string' ? own : undefined,
    imported.folder ?? undefined,
  ]) {
    const parsed = modelName.safeParse(candidate?.replace(/[\u0000-\u001f\u007f]/g, ' ').slice(0, 80));
    if (parsed.success) return parsed.data;
  }
  return 'Imported model';
}

// Reading and checking a setup takes a few milliseconds of the one thread every
// request shares; the import lets the others in between batches of this many.
const BATCH = 25;
const nextTurn = () => new Promise<void>((resolve) => setImmediate(resolve));

/** Every setup read and checked before anything is written; one bad text refuses the whole import. */
async function checkAll(imported: ImportedModel, done: () => Promise<void>): Promise<CheckedSetup[]> {
  const setups: CheckedSetup[] = [];
  for (const [index, revision] of imported.revisions.entries()) {
    try {
      setups.push(checkSetupText(revision.text));
    } catch (error) {
      if (!(error instanceof HttpError)) throw error;
      const where = `${imported.folder ? `${imported.folder}/` : ''}setup.yaml in commit ${revision.commit.slice(0, 12)} (revision ${index + 1})`;
      throw new HttpError(error.status, error.code, `${where}: ${error.message}`, {
        details: { ...error.details, commit: revision.commit, revision: index + 1 },
      });
    }
    if (setups.length % BATCH === 0) await done();
  }
  return setups;
}

/**
 * New models in the workspace with the imported revisions in order, their messages,
 * times and tags, in one transaction. The importer is the author of every revision
 * (Bindery attributes work only to its own accounts); an audit entry per model
 * records the import.
 */
export async function importModels(
  sequelize: Sequelize,
  input: {
    workspace: Workspace;
    author: User;
    models: ImportedModel[];
    name?: string;
    /** Refuses (throws) when the author may no longer import here; run first in the transaction. */
    requireRights: (transaction: Transaction) => Promise<void>;
  },
  report: ReportProgress,
): Promise<ImportResult[]> {
  let checkedCount = 0;
  const checkedBatch = async () => {
    checkedCount += BATCH;
    await report({ revisions_checked: checkedCount });
    await nextTurn();
  };
  const checked: { model: ImportedModel; setups: CheckedSetup[] }[] = [];
  for (const model of input.models.filter((candidate) => candidate.revisions.length > 0))
    checked.push({ model, setups: await checkAll(model, checkedBatch) });
  await report({ revisions_checked: checked.reduce((sum, entry) => sum + entry.setups.length, 0) });
  let stored = 0;
  const storedOne = async () => {
    if (++stored % BATCH === 0) await report({ revisions_stored: stored });
  };
  const results = await sequelize.transaction(async (transaction) => {
    await input.requireRights(transaction);
    const results: ImportResult[] = [];
    for (const { model: imported, setups } of checked) {
      const name = nameFor(imported, setups, input.models.length === 1 ? input.name : undefined);
      const [first, ...rest] = imported.revisions;
      const created = await insertModelWithFirstRevision(
        sequelize,
        {
          workspace: input.workspace,
          author: input.author,
          name,
          setup: setups[0],
          message: first.message,
          origin: 'upload',
          createdAt: first.createdAt,
        },
        transaction,
      );
      const locked: LockedModel = { model: created.model, latest: created.revision };
      const revisionIds = [created.revision.id];
      await storedOne();
      for (const [index, revision] of rest.entries()) {
        const appended = await appendRevision(
          sequelize,
          locked,
          setups[index + 1],
          { author: input.author, message: revision.message, origin: 'upload', createdAt: revision.createdAt },
          transaction,
        );
        locked.latest = appended;
        revisionIds.push(appended.id);
        await storedOne();
      }
      await Tag.bulkCreate(
        imported.tags.map((tag) => ({
          modelId: created.model.id,
          revisionId: revisionIds[tag.index],
          name: tag.name,
          createdBy: input.author.id,
        })),
        { transaction },
      );
      const hashMismatches = imported.revisions.flatMap((revision, index) =>
        revision.recordedHash && revision.recordedHash !== setups[index].contentHash
          ? [{ number: index + 1, recorded: revision.recordedHash, computed: setups[index].contentHash }]
          : [],
      );
      await recordAuditEvent(
        {
          workspaceId: input.workspace.id,
          actor: input.author,
          action: 'model.created',
          subjectType: 'model',
          subjectId: created.model.id,
          details: {
            name,
            origin: 'import',
            revisions: revisionIds.length,
            tags: imported.tags.length,
            revision_id: locked.latest?.id ?? null,
          },
        },
        transaction,
      );
      results.push({ model: created.model, revisions: revisionIds.length, tags: imported.tags.length, hashMismatches });
    }
    return results;
  });
  await report({ revisions_stored: stored });
  return results;
}
