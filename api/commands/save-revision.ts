import type { Sequelize, Transaction } from 'sequelize';
import { analyzeSetup, type Analysis } from '../../shared/analyze';
import { contentHash } from '../../shared/canonical/content-hash';
import { AIRFRAMES } from '../../shared/format/schema';
import { MAX_TEXT_BYTES } from '../../shared/parse/limits';
import { Conflict, NotFound, TooLarge, Unprocessable } from '../errors';
import { Revision, SetupModel, type User } from '../models';
import type { RevisionOrigin } from '../models/Revision';
import { recordAuditEvent, type AuditAction } from './record-audit-event';

/** Setup text that has been read and checked, ready to be stored. */
/**
 * Runs `work` in the caller's transaction when there is one (the demo seed writes a
 * whole history in one), otherwise in a transaction of its own.
 */
export function inTransaction<T>(sequelize: Sequelize, outer: Transaction | undefined, work: (transaction: Transaction) => Promise<T>): Promise<T> {
  return outer ? work(outer) : sequelize.transaction(work);
}

export interface CheckedSetup {
  text: string;
  analysis: Analysis & { readable: true };
  contentHash: string;
}

// PostgreSQL's text and jsonb cannot hold U+0000, so such a setup could not be stored
// as sent; it is refused rather than altered.
const NUL = '\u0000';

/**
 * Reads and checks setup text before anything is stored (and before any lock is
 * taken). Unreadable text is refused with its syntax findings; a readable setup with
 * check errors is accepted: history keeps everything.
 */
export function checkSetupText(text: string): CheckedSetup {
  const bytes = Buffer.byteLength(text, 'utf8');
  if (bytes > MAX_TEXT_BYTES) {
    throw new TooLarge(`The setup is ${Math.ceil(bytes / 1024)} KB; setups up to ${MAX_TEXT_BYTES / 1024} KB are accepted.`, {
      details: { bytes, limit: MAX_TEXT_BYTES },
    });
  }
  const analysis = analyzeSetup(text);
  if (!analysis.readable) {
    const first = analysis.findings[0];
    const where = first ? ` (line ${first.line}, column ${first.column}: ${first.message})` : '';
    throw new Unprocessable(`The setup could not be read as YAML, so nothing was saved${where}.`, {
      code: 'unreadable-setup',
      details: { findings: analysis.findings, counts: analysis.counts },
    });
  }
  if (text.includes(NUL) || JSON.stringify(analysis.data).includes('\\u0000')) {
    throw new Unprocessable('The setup contains a NUL character (\\0), which cannot be stored; nothing was saved.', { code: 'unreadable-setup', details: { findings: [] } });
  }
  return { text, analysis: analysis as CheckedSetup['analysis'], contentHash: contentHash(analysis.data) };
}

/** The airframe kind a setup names, when it names one the format knows. */
export function airframeOf(data: unknown): string | null {
  const model = (data as { model?: { airframe?: unknown } } | null)?.model;
  const airframe = model && typeof model === 'object' ? model.airframe : undefined;
  return typeof airframe === 'string' && (AIRFRAMES as readonly string[]).includes(airframe) ? airframe : null;
}

export interface LockedModel {
  model: SetupModel;
  latest: Pick<Revision, 'id' | 'number'> | null;
}

/**
 * Locks the model's row (SELECT ... FOR UPDATE) for the rest of the transaction and
 * reads its latest revision number. Every write to a model's history goes through
 * this lock, so concurrent saves on one base queue up and all but the first find
 * their base stale.
 */
export async function lockModel(modelId: string, transaction: Transaction): Promise<LockedModel> {
  const model = await SetupModel.findByPk(modelId, { lock: transaction.LOCK.UPDATE, transaction });
  if (!model) throw new NotFound('No such model.', { code: 'model-not-found' });
  const latest = await Revision.findOne({ where: { modelId }, attributes: ['id', 'number'], order: [['number', 'DESC']], transaction });
  return { model, latest };
}

export function requireLatestBase(latest: LockedModel['latest'], base: number): void {
  const latestNumber = latest?.number ?? 0;
  if (base !== latestNumber) {
    throw new Conflict(`Revision ${base} is not the latest: revision ${latestNumber} was saved meanwhile. Look at what changed and save again on revision ${latestNumber}.`, {
      code: 'stale-base',
      details: { base, latest: latestNumber, latest_id: latest?.id ?? null },
    });
  }
}

export interface AppendInput {
  author: User;
  message: string;
  origin: RevisionOrigin;
  sourceRevisionId?: string | null;
  /** For the demo seed, which writes a history with its original dates. */
  createdAt?: Date;
}

/** Adds the next revision to a model locked by `lockModel` and keeps the model's airframe current. */
export async function appendRevision(locked: LockedModel, setup: CheckedSetup, input: AppendInput, transaction: Transaction): Promise<Revision> {
  const { model, latest } = locked;
  const { findings, counts, data } = setup.analysis;
  const revision = await Revision.create(
    {
      modelId: model.id,
      number: (latest?.number ?? 0) + 1,
      parentId: latest?.id ?? null,
      authorId: input.author.id,
      message: input.message,
      yamlText: setup.text,
      document: data,
      contentHash: setup.contentHash,
      findings,
      errorCount: counts.errors,
      warningCount: counts.warnings,
      infoCount: counts.infos,
      origin: input.origin,
      sourceRevisionId: input.sourceRevisionId ?? null,
      ...(input.createdAt ? { createdAt: input.createdAt } : {}),
    },
    { transaction },
  );
  revision.author = input.author;
  const airframe = airframeOf(data) ?? model.airframe;
  const updatedAt = input.createdAt ?? revision.createdAt;
  await model.sequelize.query('UPDATE models SET airframe = $airframe, updated_at = $updatedAt WHERE id = $id', {
    bind: { airframe, updatedAt, id: model.id },
    transaction,
  });
  model.set({ airframe, updatedAt }, { raw: true });
  return revision;
}

export interface SaveRevisionInput {
  modelId: string;
  author: User;
  base: number;
  yaml: string;
  message?: string;
  origin?: Extract<RevisionOrigin, 'save' | 'upload'>;
  createdAt?: Date;
  transaction?: Transaction;
}

const AUDIT_FOR: Record<'save' | 'upload', AuditAction> = { save: 'revision.saved', upload: 'revision.uploaded' };

/** Saves a new revision on `base`: refused (409) unless `base` is still the latest number. */
export async function saveRevision(sequelize: Sequelize, input: SaveRevisionInput): Promise<Revision> {
  const setup = checkSetupText(input.yaml);
  const origin = input.origin ?? 'save';
  return inTransaction(sequelize, input.transaction, async (transaction) => {
    const locked = await lockModel(input.modelId, transaction);
    requireLatestBase(locked.latest, input.base);
    const revision = await appendRevision(locked, setup, { author: input.author, message: input.message ?? '', origin, createdAt: input.createdAt }, transaction);
    await recordAuditEvent(
      {
        workspaceId: locked.model.workspaceId,
        actor: input.author,
        action: AUDIT_FOR[origin],
        subjectType: 'revision',
        subjectId: revision.id,
        details: { model_id: locked.model.id, number: revision.number, content_hash: revision.contentHash, errors: revision.errorCount },
        createdAt: input.createdAt,
      },
      transaction,
    );
    return revision;
  });
}
