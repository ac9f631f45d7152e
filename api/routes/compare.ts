import { Router } from 'express';
import { findingsDelta, textDiff } from '@shared/diff';
import type { AppContext } from '../context';
import { authenticate } from '../middleware/authenticate';
import { CHANGE_CHECKS } from '@shared/diff/change-findings';
import { applyClubRules, type ClubRules } from '@shared/rules/club-rules';
import { Revision, User } from '../models';
import { rulesOf } from '../models/ClubRules';
import type { RevisionAccess } from '../access/records';
import { authorizeRevision } from './authorize';
import { presentRevisionSummary } from '../presenters/revision';
import { contentComparisonJson } from '../queries/compare-cache';
import { tagsByRevision } from '../queries/model-views';
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

async function documentsOf(from: Revision, to: Revision): Promise<[unknown, unknown]> {
  const rows = await Revision.findAll({
    where: { id: [...new Set([from.id, to.id])] },
    attributes: ['id', 'document'],
  });
  const documentOf = (id: string) => rows.find((row) => row.id === id)!.document;
  return [documentOf(from.id), documentOf(to.id)];
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
    const [from, to] = await Promise.all([
      authorizeRevision(req, query.from, 'read', { fields: ['findings'] }),
      authorizeRevision(req, query.to, 'read', { fields: ['findings'] }),
    ]);
    // The change findings are about the newer side: its workspace's rules rank them.
    const [authors, tags, cached, rules] = await Promise.all([
      User.findAll({
        where: { id: [...new Set([from.revision.authorId, to.revision.authorId])] },
        attributes: ['id', 'name'],
      }),
      tagsByRevision([from.revision.id, to.revision.id]),
      contentComparisonJson(sequelize, { from: from.revision.contentHash, to: to.revision.contentHash }, () =>
        documentsOf(from.revision, to.revision),
      ),
      rulesOf(to.model.workspaceId),
    ]);
    const content = withClubRules(cached, rules);
    const side = (access: RevisionAccess) => {
      access.revision.author = authors.find((user) => user.id === access.revision.authorId);
      return {
        ...presentRevisionSummary(access.revision, tags.get(access.revision.id) ?? []),
        model: { id: access.model.id, name: access.model.name, workspace_id: access.model.workspaceId },
      };
    };
    const head = JSON.stringify({
      from: side(from),
      to: side(to),
      findings_delta: findingsDelta(from.revision.findings, to.revision.findings),
    });
    // The cached part is an object's JSON text; it joins the head's object unparsed.
    res.type('application/json').send(`{"data":${head.slice(0, -1)},${content.slice(1)}}`);
  });

  // The line-by-line diff of the two stored texts.
  router.get('/compare/text', signedIn, async (req, res) => {
    const query = parseInput(compareQuery, req.query, QUERY_MESSAGE);
    const [from, to] = await Promise.all([
      authorizeRevision(req, query.from, 'read', { fields: ['yamlText'] }),
      authorizeRevision(req, query.to, 'read', { fields: ['yamlText'] }),
    ]);
    res.json({ data: textDiff(from.revision.yamlText, to.revision.yamlText) });
  });

  return router;
}
