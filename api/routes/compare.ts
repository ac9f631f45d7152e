import { Router } from 'express';
import { compareRevisions, type CompareSide } from '../../shared/diff';
import type { Finding } from '../../shared/findings';
import type { AppContext } from '../context';
import { authenticate } from '../middleware/authenticate';
import { User } from '../models';
import type { RevisionAccess } from '../policies/model';
import { authorizeRevision } from '../policies/model';
import { presentRevisionSummary } from '../presenters/revision';
import { tagsByRevision } from '../queries/model-views';
import { parseInput } from '../validation';
import { compareQuery } from './model-inputs';

const sideOf = ({ revision }: RevisionAccess): CompareSide => ({
  text: revision.yamlText,
  data: revision.document,
  findings: revision.findings,
});

export function compareRouter({ config }: AppContext): Router {
  const router = Router();

  // Any two revisions the caller may read: of one model, or of two (a fork and its
  // source), each side authorised on its own.
  router.get('/compare', authenticate(config), async (req, res) => {
    const query = parseInput(
      compareQuery,
      req.query,
      'Name the two revisions to compare: ?from=<revision id>&to=<revision id>.',
    );
    const [from, to] = await Promise.all([
      authorizeRevision(req, query.from, 'read', { full: true }),
      authorizeRevision(req, query.to, 'read', { full: true }),
    ]);
    const [authors, tags] = await Promise.all([
      User.findAll({
        where: { id: [...new Set([from.revision.authorId, to.revision.authorId])] },
        attributes: ['id', 'name'],
      }),
      tagsByRevision([from.revision.id, to.revision.id]),
    ]);
    const side = (access: RevisionAccess) => {
      access.revision.author = authors.find((user) => user.id === access.revision.authorId);
      return {
        ...presentRevisionSummary(access.revision, tags.get(access.revision.id) ?? []),
        model: { id: access.model.id, name: access.model.name, workspace_id: access.model.workspaceId },
      };
    };
    const comparison = compareRevisions(sideOf(from), sideOf(to));
    res.json({ data: { from: side(from), to: side(to), ...comparison } });
  });

  return router;
}
