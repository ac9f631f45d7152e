import type { Sequelize } from 'sequelize';
import type { Role } from '@shared/contract/roles';
import { COMPARE_FORMAT_VERSION } from '@shared/diff';
import type { Finding } from '@shared/findings';
import type { RuleSeverity } from '@shared/rules/club-rules';
import { callerMembershipJoin, callerRole } from '../access/membership';
import { preparedStatement, runPrepared, type PreparedStatement } from '../db/prepared';
import type { RevisionOrigin } from '../models/Revision';

// The reads of a compare's two sides, one prepared statement per route (api/db/prepared.ts).
// A warm compare was about 9 statements through Sequelize's models, whose mapping (and
// lodash under it) took about 40% of the API worker's CPU; now it is the session check
// and one statement. Nothing here decides who may read what: each side comes with the
// caller's role for the route's policy (api/routes/authorize.ts).

/** The caller's id is `$3` in every statement below (the two revision ids are `$1`, `$2`). */
const caller = callerMembershipJoin('m.workspace_id', '$3');

/**
 * One row per side that exists: `side` 1 for `$1` (from), 2 for `$2` (to), two rows
 * for a revision compared with itself. The revision's model and the caller's
 * membership of its workspace come by key, so the read stays an index walk however
 * large the tables grow (tests/api/history-plan.test.ts reads its plan).
 */
const SIDES = `FROM (VALUES (1, $1::uuid), (2, $2::uuid)) AS s (side, id)
  JOIN revisions r ON r.id = s.id
  JOIN models m ON m.id = r.model_id
  ${caller.join}`;

/** A revision of a compare, with what the route needs to decide on and present it. */
export interface CompareSide {
  id: string;
  modelId: string;
  number: number;
  parentId: string | null;
  authorId: string;
  message: string;
  contentHash: string;
  findings: Finding[];
  errorCount: number;
  warningCount: number;
  infoCount: number;
  origin: RevisionOrigin;
  sourceRevisionId: string | null;
  createdAt: Date;
  modelName: string;
  workspaceId: string;
  /** Null when the author's account is gone (the presenters answer a null author then). */
  authorName: string | null;
  tagNames: string[];
  /**
   * The pair's cached content comparison (api/queries/compare-cache.ts) and the club's
   * rule severities of the newer side's workspace (null: the defaults): on the "to"
   * side only, so the cached text comes over the wire once.
   */
  cachedResult: string | null;
  ruleSeverities: Record<string, RuleSeverity> | null;
  role: Role | null;
}

// The columns come under the presenters' attribute names, so a row presents as it is
// (api/presenters/revision.ts). The documents are not read: a warm compare never needs
// them (documentsOf below reads them on a miss); the cache row is joined on the "to"
// side through the "from" revision's content hash, the club's rules likewise.
const compareSides = preparedStatement(
  'compare-sides',
  `SELECT s.side, r.id, r.model_id AS "modelId", r.number, r.parent_id AS "parentId", r.author_id AS "authorId",
          r.message, r.content_hash AS "contentHash", r.findings, r.error_count AS "errorCount",
          r.warning_count AS "warningCount", r.info_count AS "infoCount", r.origin,
          r.source_revision_id AS "sourceRevisionId", r.created_at AS "createdAt",
          m.name AS "modelName", m.workspace_id AS "workspaceId", ${caller.select}, u.name AS "authorName",
          ARRAY(SELECT t.name FROM tags t WHERE t.revision_id = r.id) AS "tagNames",
          cache.result AS "cachedResult", rules.severities AS "ruleSeverities"
     ${SIDES}
     LEFT JOIN users u ON u.id = r.author_id
     LEFT JOIN revisions older ON s.side = 2 AND older.id = $1
     LEFT JOIN compare_cache cache
       ON cache.from_hash = older.content_hash AND cache.to_hash = r.content_hash AND cache.format_version = $4
     LEFT JOIN club_rules rules ON s.side = 2 AND rules.workspace_id = m.workspace_id`,
);

/**
 * Runs a sides statement (`$1`, `$2` the revisions, `$3` the caller, then `more`) and
 * answers [from, to] with the caller's role, each undefined when there is no such revision.
 */
async function readSides<Side extends { role: Role | null }>(
  sequelize: Sequelize,
  statement: PreparedStatement,
  callerId: string,
  [fromId, toId]: readonly [string, string],
  more: readonly unknown[] = [],
): Promise<[Side | undefined, Side | undefined]> {
  type Row = Omit<Side, 'role'> & { side: 1 | 2; caller_role: unknown };
  const rows = await runPrepared<Row>(sequelize, statement, [fromId, toId, callerId, ...more]);
  const side = (number: 1 | 2): Side | undefined => {
    const row = rows.find((candidate) => candidate.side === number);
    if (!row) return undefined;
    const { side: _side, caller_role: _role, ...fields } = row;
    // The row less its two columns, plus the role, is a Side; TypeScript cannot see
    // through Omit of a type parameter.
    return { ...fields, role: callerRole(row) } as unknown as Side;
  };
  return [side(1), side(2)];
}

/** Both sides of `GET /api/compare` in one round trip. */
export function loadCompareSides(sequelize: Sequelize, callerId: string, ids: readonly [string, string]) {
  return readSides<CompareSide>(sequelize, compareSides, callerId, ids, [COMPARE_FORMAT_VERSION]);
}

export interface TextSide {
  yamlText: string;
  role: Role | null;
}

const textSides = preparedStatement(
  'compare-text-sides',
  `SELECT s.side, r.yaml_text AS "yamlText", ${caller.select} ${SIDES}`,
);

/** Both sides' stored texts for `GET /api/compare/text`, with the caller's role. */
export function loadTextSides(sequelize: Sequelize, callerId: string, ids: readonly [string, string]) {
  return readSides<TextSide>(sequelize, textSides, callerId, ids);
}

const documents = preparedStatement('compare-documents', 'SELECT id, document FROM revisions WHERE id IN ($1, $2)');

/** The two documents, read only when the cache has no comparison of their contents. */
export async function documentsOf(sequelize: Sequelize, fromId: string, toId: string): Promise<[unknown, unknown]> {
  const rows = await runPrepared<{ id: string; document: unknown }>(sequelize, documents, [fromId, toId]);
  const documentOf = (id: string) => rows.find((row) => row.id === id)!.document;
  return [documentOf(fromId), documentOf(toId)];
}
