import type { Sequelize } from 'sequelize';
import { ROLES, roleAtLeast, type Role } from '@shared/contract/roles';
import { countFindings } from '@shared/findings';
import { applyClubRules, type RuleSeverity } from '@shared/rules/club-rules';
import { preparedStatement, runPrepared } from '../db/prepared';
import { NotFound, roleTooLow } from '../errors';
import type { User } from '../models';
import type { RevisionOrigin } from '../models/Revision';
import { MODEL_POLICY } from '../policies/model';
import type { SavedRevisionFacts } from '../presenters/revision';
import { idSchema } from '../validation';
import type { AuditAction } from '../audit/record-audit-event';
import { requireLatestBase } from '../revisions/check-base';
import { airframeOf, type CheckedSetup } from '../revisions/check-setup';
import { setupModelName } from '../revisions/follow-name';

export interface SaveAtOnceInput {
  modelId: unknown;
  author: User;
  base: number;
  /** Read and checked before anything is asked of the database (checkSetupText). */
  setup: CheckedSetup;
  message: string;
  origin: Extract<RevisionOrigin, 'save' | 'upload'>;
}

const AUDIT_FOR: Record<SaveAtOnceInput['origin'], AuditAction> = {
  save: 'revision.saved',
  upload: 'revision.uploaded',
};

// Everyone whose role may edit a model: the database function compares the caller's
// role with this list, so the order of roles stays written once (shared/contract/roles).
const EDITING_ROLES: readonly Role[] = ROLES.filter((role) => roleAtLeast(role, MODEL_POLICY.edit));

// A fixed text, so it runs as a named prepared statement: planned once per connection
// and sent without its text or a trip through Sequelize's query pipeline. The order of
// the values follows the function's parameters (migration 0030).
const SAVE_REVISION = preparedStatement(
  'save-revision',
  `SELECT * FROM save_revision($1, $2, $3, $4, $5, $6, $7::jsonb, $8, $9::jsonb, $10, $11, $12, $13, $14, $15,
                               $16::jsonb, $17)`,
);

interface SaveOutcome {
  outcome: 'saved' | 'not-found' | 'role-too-low' | 'stale-base';
  caller_role: Role | null;
  revision_id: string | null;
  revision_number: number | null;
  revision_created_at: Date | null;
  latest_id: string | null;
  latest_number: number | null;
  /** The severities of the club rules in force in the model's workspace (migration 0090). */
  club_severities: Record<string, RuleSeverity> | null;
}

/**
 * The API's save of a checked setup as one statement (the save_revision function,
 * migrations 0030, 0059, 0090): membership and role, the model's row lock, the base
 * check, the insert, the model's airframe, the audit entry and the club's rules in one
 * round trip that commits on its own. It refuses exactly as authorizeModel and saveRevision do: 404 for a model
 * that does not exist or is another workspace's, 403 for a role below editor, 409
 * `stale-base` when another save came first. The answer is built from what was sent
 * and the few columns the database made (id, time), never read back.
 *
 * The answer's findings and counts follow the club's rules as every read does
 * (followClubRules), from the severities the function answered. The changed settings
 * (provenance) are the caller's to record once it has answered (recordChangesLater).
 */
export async function saveRevisionAtOnce(sequelize: Sequelize, input: SaveAtOnceInput): Promise<SavedRevisionFacts> {
  // Made only when it is thrown: an error records its stack trace when it is built.
  const notFound = () => new NotFound('No such model.', { code: 'model-not-found' });
  const modelId = idSchema.safeParse(input.modelId);
  if (!modelId.success) throw notFound();
  const { setup, author } = input;
  const { data, findings, counts } = setup.analysis;
  const [row] = await runPrepared<SaveOutcome>(sequelize, SAVE_REVISION, [
    modelId.data,
    author.id,
    EDITING_ROLES,
    input.base,
    input.message,
    setup.text,
    setup.documentJson,
    setup.contentHash,
    JSON.stringify(findings),
    counts.errors,
    counts.warnings,
    counts.infos,
    input.origin,
    airframeOf(data),
    AUDIT_FOR[input.origin],
    JSON.stringify({ model_id: modelId.data, content_hash: setup.contentHash, errors: counts.errors }),
    setupModelName(data),
  ]);
  if (!row || row.outcome === 'not-found' || !row.caller_role) throw notFound();
  if (row.outcome === 'role-too-low') throw roleTooLow(MODEL_POLICY.edit, row.caller_role);
  if (row.outcome === 'stale-base')
    requireLatestBase(row.latest_id ? { id: row.latest_id, number: row.latest_number ?? 0 } : null, input.base);
  if (row.outcome !== 'saved' || !row.revision_id || row.revision_number === null || !row.revision_created_at)
    throw new Error(`save_revision answered ${JSON.stringify(row)}`);
  const severities = row.club_severities ?? {};
  const ruled = Object.keys(severities).length > 0 ? applyClubRules(findings, { severities }) : findings;
  const ruledCounts = ruled === findings ? counts : countFindings(ruled);
  // Plain facts, not a built Revision: the answer is all that reads them.
  return {
    id: row.revision_id,
    modelId: modelId.data,
    number: row.revision_number,
    parentId: row.latest_id,
    author,
    message: input.message,
    contentHash: setup.contentHash,
    findings: ruled,
    errorCount: ruledCounts.errors,
    warningCount: ruledCounts.warnings,
    infoCount: ruledCounts.infos,
    origin: input.origin,
    sourceRevisionId: null,
    createdAt: new Date(row.revision_created_at),
  };
}
