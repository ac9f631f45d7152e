import { Router } from 'express';
import { findingsDelta, textDiff } from '@shared/diff';
import type { AppContext } from '../context';
import { authenticate } from '../middleware/authenticate';
import { CHANGE_CHECKS } from '@shared/diff/change-findings';
import { applyClubRules, DEFAULT_CLUB_RULES, type ClubRules } from '@shared/rules/club-rules';
import { authorizeRevisionPair } from './authorize';
import { presentRevisionSummary } from '../presenters/revision';
import { computeAndCacheComparison } from '../queries/compare-cache';
import { documentsOf, loadCompareSides, loadTextSides, type CompareSide } from '../queries/compare-sides';
import { parseInput } from '../validation';
import { compareQuery } from './model-inputs';

const QUERY_MESSAGE = 'Name the two revisions to compare: ?from=<revision id>&to=<revision id>.';

/**
 * The cached comparison's text with the change findings as the club's rules have them.
 * The cache is shared by content across workspaces, so the rules apply after it; the
 * text is parsed only when the rules touch a check across two revisions.
 */
function withClubRules(content: string, rules: Pick<ClubRules, 'severities'>): string {
  if (!CHANGE_CHECKS.some((check) => rules.severities[check.id] !== undefined)) return content;
  const parsed = JSON.parse(content) as { change_findings: Parameters<typeof applyClubRules>[0] | null };
  if (parsed.change_findings) parsed.change_findings = applyClubRules(parsed.change_findings, rules);
  return JSON.stringify(parsed);
}

export function compareRouter({ sequelize, config }: AppContext): Router {
  const router = Router();
  const signedIn = authenticate(config);

  // Any two revisions the caller may read: of one model, or of two (a fork and its
  // source), each side authorised on its own. The semantic diff and the outputs delta
  // come from the shared compare cache (by content hash); the findings delta is
  // computed here because findings carry line numbers the content hash ignores. The
  // YAML text diff has its own route below, loaded when the reader opens it.
  router.get('/compare', signedIn, async (req, res) => {
    const query = parseInput(compareQuery, req.query, QUERY_MESSAGE);
    // Both sides, their authors, tags, the cached comparison and the newer side's club
    // rules in one statement; the documents only on a cache miss.
    const [from, to] = await authorizeRevisionPair(req, [query.from, query.to], 'read', (callerId, ids) =>
      loadCompareSides(sequelize, callerId, ids),
    );
    const cached =
      to.cachedResult ??
      (await computeAndCacheComparison(
        sequelize,
        { from: from.contentHash, to: to.contentHash },
        await documentsOf(sequelize, from.id, to.id),
      ));
    // The change findings are about the newer side: its workspace's rules rank them.
    const content = withClubRules(cached, { severities: to.ruleSeverities ?? DEFAULT_CLUB_RULES.severities });
    const present = (side: CompareSide) => ({
      ...presentRevisionSummary(
        { ...side, author: side.authorName === null ? null : { id: side.authorId, name: side.authorName } },
        side.tagNames,
      ),
      model: { id: side.modelId, name: side.modelName, workspace_id: side.workspaceId },
    });
    const head = JSON.stringify({
      from: present(from),
      to: present(to),
      findings_delta: findingsDelta(from.findings, to.findings),
    });
    // The cached part is an object's JSON text; it joins the head's object unparsed.
    res.type('application/json').send(`{"data":${head.slice(0, -1)},${content.slice(1)}}`);
  });

  // The line-by-line diff of the two stored texts.
  router.get('/compare/text', signedIn, async (req, res) => {
    const query = parseInput(compareQuery, req.query, QUERY_MESSAGE);
    const [from, to] = await authorizeRevisionPair(req, [query.from, query.to], 'read', (callerId, ids) =>
      loadTextSides(sequelize, callerId, ids),
    );
    res.json({ data: textDiff(from.yamlText, to.yamlText) });
  });

  return router;
}
