import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { analyzeSetup, type Analysis } from '@shared/analyze';
import { contentHash } from '@shared/canonical/content-hash';
import { AIRFRAMES } from '@shared/format/schema';
import { MAX_TEXT_BYTES } from '@shared/parse/limits';
import { Conflict, NotFound, TooLarge, Unprocessable } from '../errors';
import { recordChanges } from '../provenance/record-changes';
import { followClubRules, Revision, SetupModel, type User } from '../models';
import type { RevisionOrigin } from '../models/Revision';
import type { AuditAction } from './record-audit-event';

/** Setup text that has been read and checked, ready to be stored. */
/**
 * Runs `work` in the caller's transaction when there is one (the demo seed writes a
 * whole history in one), otherwise in a transaction of its own.
 */
export function inTransaction<T>(
  sequelize: Sequelize,
  outer: Transaction | undefined,
  work: (transaction: Transaction) => Promise<T>,
): Promise<T> {
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
    throw new TooLarge(
      `The setup is ${Math.ceil(bytes / 1024)} KB; setups up to ${MAX_TEXT_BYTES / 1024} KB are accepted.`,
      {
        details: { bytes, limit: MAX_TEXT_BYTES },
      },
    );
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
    throw new Unprocessable('The setup contains a NUL character (\\0), which cannot be stored; nothing was saved.', {
      code: 'unreadable-setup',
      details: { findings: [] },
    });
  }
  return { text, analysis: analysis as CheckedSetup['analysis'], contentHash: contentHash(analysis.data) };
}

/** The airframe kind a setup names, when it names one the format knows. */
export function airframeOf(data: unknown): string | null {
  const model = (data as { model?: { airframe?: unknown } } | null)?.model;
  const airframe = model && typeof model === 'object' ? model.airframe : undefined;
  return typeof airframe === 'string' && (AIRFRAMES as readonly string[]).includes(airframe) ? airframe : null;
}

/** The model row as the save path needs it; a full SetupModel when the caller has one. */
export type LockedModelRow = Pick<SetupModel, 'id' | 'workspaceId' | 'airframe'> & Partial<Pick<SetupModel, 'set'>>;

export interface LockedModel {
  model: LockedModelRow;
  latest: Pick<Revision, 'id' | 'number'> | null;
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
  const [row] = await sequelize.query<{ id: string; workspace_id: string; airframe: string | null }>(
    'SELECT id, workspace_id, airframe FROM models WHERE id = $id FOR UPDATE',
    { bind: { id: modelId }, type: QueryTypes.SELECT, transaction },
  );
  if (!row) throw new NotFound('No such model.', { code: 'model-not-found' });
  const [latest] = await sequelize.query<{ id: string; number: number }>(
    'SELECT id, number FROM revisions WHERE model_id = $id ORDER BY number DESC LIMIT 1',
    {
      bind: { id: modelId },
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  return { model: { id: row.id, workspaceId: row.workspace_id, airframe: row.airframe }, latest: latest ?? null };
}

export function requireLatestBase(latest: LockedModel['latest'], base: number): void {
  const latestNumber = latest?.number ?? 0;
  if (base !== latestNumber) {
    throw new Conflict(
      `Revision ${base} is not the latest: revision ${latestNumber} was saved meanwhile. Look at what changed and save again on revision ${latestNumber}.`,
      {
        code: 'stale-base',
        details: { base, latest: latestNumber, latest_id: latest?.id ?? null },
      },
    );
  }
}

/** An audit entry written in the same statement as the revision it is about. */
export interface RevisionAudit {
  action: AuditAction;
  details: Record<string, unknown>;
}

export interface AppendInput {
  author: User;
  message: string;
  origin: RevisionOrigin;
  sourceRevisionId?: string | null;
  /** For the demo seed, which writes a history with its original dates. */
  createdAt?: Date;
  audit?: RevisionAudit;
}

// One statement inserts the revision, keeps the model's airframe and change time
// current and, when asked, writes the audit entry: a save holds the model's lock for
// as few round trips as possible.
const APPEND_SQL = `
  WITH inserted AS (
    INSERT INTO revisions (model_id, number, parent_id, author_id, message, yaml_text, document, content_hash, findings,
                           error_count, warning_count, info_count, origin, source_revision_id, created_at)
    VALUES ($modelId, $number, $parentId, $authorId, $message, $yamlText, $document::jsonb, $contentHash, $findings::jsonb,
            $errorCount, $warningCount, $infoCount, $origin, $sourceRevisionId, coalesce($createdAt::timestamptz, clock_timestamp()))
    RETURNING id, created_at
  ), touched AS (
    UPDATE models SET airframe = $airframe, updated_at = (SELECT created_at FROM inserted) WHERE id = $modelId
  ), audited AS (
    INSERT INTO audit_events (workspace_id, actor_id, action, subject_type, subject_id, details, created_at)
    SELECT $workspaceId, $authorId, $auditAction, 'revision', inserted.id, $auditDetails::jsonb, inserted.created_at
      FROM inserted WHERE $auditAction::text IS NOT NULL
  )
  SELECT id, created_at FROM inserted`;

/** Adds the next revision to a model locked by `lockModel` and keeps the model's airframe current. */
export async function appendRevision(
  sequelize: Sequelize,
  locked: LockedModel,
  setup: CheckedSetup,
  input: AppendInput,
  transaction: Transaction,
): Promise<Revision> {
  const { model, latest } = locked;
  const { findings, counts, data } = setup.analysis;
  const values = {
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
  };
  const airframe = airframeOf(data) ?? model.airframe;
  const [row] = await sequelize.query<{ id: string; created_at: Date }>(APPEND_SQL, {
    bind: {
      ...values,
      document: JSON.stringify(data),
      findings: JSON.stringify(findings),
      createdAt: input.createdAt ?? null,
      airframe,
      workspaceId: model.workspaceId,
      auditAction: input.audit?.action ?? null,
      auditDetails: JSON.stringify({
        model_id: model.id,
        number: values.number,
        content_hash: setup.contentHash,
        errors: counts.errors,
        ...input.audit?.details,
      }),
    },
    type: QueryTypes.SELECT,
    transaction,
  });
  await recordChanges(sequelize, model.id, transaction);
  // raw: a built instance that is not new ignores writes to its timestamps otherwise.
  const revision = Revision.build(
    { ...values, id: row.id, createdAt: new Date(row.created_at) },
    { isNewRecord: false, raw: true },
  );
  revision.author = input.author;
  await followClubRules([revision], transaction);
  model.set?.({ airframe, updatedAt: revision.createdAt }, { raw: true });
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
    const locked = await lockModel(sequelize, input.modelId, transaction);
    requireLatestBase(locked.latest, input.base);
    return appendRevision(
      sequelize,
      locked,
      setup,
      {
        author: input.author,
        message: input.message ?? '',
        origin,
        createdAt: input.createdAt,
        audit: { action: AUDIT_FOR[origin], details: {} },
      },
      transaction,
    );
  });
}
