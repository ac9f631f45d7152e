import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { preparedIn } from '../db/prepared';
import { auditBindings, auditInsertSql, type AuditAction } from '../audit/record-audit-event';
import { followClubRules, Revision, type User } from '../models';
import type { RevisionOrigin } from '../models/Revision';
import { recordChanges } from '../provenance/record-changes';
import { airframeOf, type CheckedSetup } from './check-setup';
import { followModelName } from './follow-name';
import type { LockedModel } from './lock-model';

/** The audit entry about the revision, written by the same statement that writes it. */
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
  /** The model's name follows a changed `model.name` (follow-name.ts). */
  followName?: boolean;
}

// One statement inserts the revision, keeps the model's airframe and change time
// current and, when asked, writes the audit entry (its SQL is the audit recorder's):
// a save holds the model's lock for as few round trips as possible.
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
    ${auditInsertSql('inserted')}
  )
  SELECT id, created_at FROM inserted`;

/**
 * Adds the next revision to a model locked by `lockModel` (whose base the caller has
 * checked) and keeps the model's airframe current.
 */
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
  const audit = input.audit
    ? {
        workspaceId: model.workspaceId,
        actor: input.author,
        action: input.audit.action,
        subjectType: 'revision' as const,
        details: {
          model_id: model.id,
          number: values.number,
          content_hash: setup.contentHash,
          errors: counts.errors,
          ...input.audit.details,
        },
      }
    : null;
  const [row] = await sequelize.query<{ id: string; created_at: Date }>(APPEND_SQL, {
    bind: {
      ...values,
      document: setup.documentJson,
      findings: JSON.stringify(findings),
      createdAt: input.createdAt ?? null,
      airframe,
      ...auditBindings(audit),
    },
    type: QueryTypes.SELECT,
    transaction,
  });
  await recordChanges(preparedIn(transaction), model.id);
  // raw: a built instance that is not new ignores writes to its timestamps otherwise.
  const revision = Revision.build(
    { ...values, id: row.id, createdAt: new Date(row.created_at) },
    { isNewRecord: false, raw: true },
  );
  revision.author = input.author;
  await followClubRules([revision], transaction);
  model.set?.({ airframe, updatedAt: revision.createdAt }, { raw: true });
  if (input.followName) await followModelName(sequelize, locked, data, input.author, revision, transaction);
  return revision;
}
