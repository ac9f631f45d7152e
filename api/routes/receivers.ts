import { Router } from 'express';
import { col, fn, literal, Op, type WhereOptions } from 'sequelize';
import { z } from 'zod';
import { SLUG_PATTERN } from '@shared/format/schema';
import { createReceiverSchema, updateReceiverSchema } from '@shared/reuse/receiver-fields';
import { addReceiver } from '../commands/add-receiver';
import { applyReceiverSettings } from '../commands/apply-receiver-settings';
import { installReceiver } from '../commands/install-receiver';
import { removeReceiver } from '../commands/remove-receiver';
import { updateReceiver } from '../commands/update-receiver';
import type { AppContext } from '../context';
import { authenticate, currentUser } from '../middleware/authenticate';
import { AuditEvent, Receiver, ReceiverInstall, SetupModel, User } from '../models';
import { receiverPolicy } from '../policies/receiver';
import { authorizeReceiver, authorizeWorkspace, modelOnShelf } from './authorize';
import { presentInstall, presentReceiver, presentReceiverEvent, presentReuseCheck } from '../presenters/receiver';
import { checkAgainstLatest } from '../queries/receiver-slot';
import { afterRow } from '../queries/keyset-page';
import { openInstalls, presentOnShelf, presentShelf } from '../queries/shelf-view';
import { parseInput } from '../validation';
import { pageInput, pagination } from './paging';

const escapeLike = (text: string): string => text.replace(/[\\%_]/g, '\\$&');

// A unit's history is two lists, each paged on its own: where it has been, and what was recorded.
const historyQuery = z.object({
  limit: pageInput().shape.limit,
  installs_offset: pageInput().shape.offset,
  events_offset: pageInput().shape.offset,
});

const shelfQuery = pageInput(100).extend({
  q: z
    .string({ error: 'q is the text to search for.' })
    .trim()
    .max(100, 'Search for at most 100 characters.')
    .optional(),
  status: z.enum(['installed', 'free'], { error: 'status is installed or free.' }).optional(),
  after: z.uuid({ error: 'after is the id of the last receiver of the page before.' }).optional(),
});

const modelId = z.uuid({ error: 'model is the id of a model in this workspace.' });
const slotId = z
  .string({ error: 'slot is the id of a receiver in the model’s setup.' })
  .regex(SLUG_PATTERN, 'slot is the id of a receiver in the model’s setup.');

const reuseQuery = z.object({ model: modelId, slot: slotId });
const installSchema = z.strictObject({
  model: modelId,
  slot: slotId,
  move: z.boolean({ error: 'move is true or false.' }).default(false),
});
const applySchema = z.strictObject({
  revision: z.uuid({ error: 'revision is the id of the revision whose check you worked from.' }).optional(),
});

// The open install of a receiver, tested in SQL so the filter and the count agree.
const OPEN_INSTALL =
  'EXISTS (SELECT 1 FROM receiver_installs i WHERE i.receiver_id = "Receiver"."id" AND i.removed_at IS NULL)';

export function receiversRouter({ sequelize, config }: AppContext): Router {
  const router = Router();
  const signedIn = authenticate(config);

  router.get('/workspaces/:ws/receivers', signedIn, async (req, res) => {
    const { q, status, limit, offset, after } = parseInput(
      shelfQuery,
      req.query,
      'The search parameters are not valid.',
    );
    const { workspace } = await authorizeWorkspace(req, req.params.ws, receiverPolicy, 'read');
    const conditions: WhereOptions<Receiver>[] = [{ workspaceId: workspace.id }];
    const cursor = after ? await afterRow(sequelize, 'receivers', workspace.id, after) : null;
    if (q) {
      const pattern = `%${escapeLike(q)}%`;
      conditions.push({
        [Op.or]: [
          { label: { [Op.iLike]: pattern } },
          { mark: { [Op.iLike]: pattern } },
          { notes: { [Op.iLike]: pattern } },
          // A code read off a label may be typed in lower case or with a space in the middle.
          { shortCode: q.toUpperCase().replace(/[\s-]/g, '') },
        ],
      });
    }
    if (status) conditions.push(literal(status === 'installed' ? OPEN_INSTALL : `NOT ${OPEN_INSTALL}`));
    // The total counts the whole filtered shelf; the page starts after the cursor when one is given.
    const [count, rows] = await Promise.all([
      Receiver.count({ where: { [Op.and]: conditions } }),
      Receiver.findAll({
        where: { [Op.and]: cursor ? [...conditions, cursor] : conditions },
        order: [
          [fn('lower', col('label')), 'ASC'],
          ['id', 'ASC'],
        ],
        // One more than asked says whether a page follows.
        limit: limit + 1,
        offset,
      }),
    ]);
    const page = rows.slice(0, limit);
    res.json({
      data: await presentShelf(page),
      pagination: {
        ...pagination({ limit, offset }, count),
        next_after: rows.length > limit ? page[page.length - 1].id : null,
      },
    });
  });

  router.post('/workspaces/:ws/receivers', signedIn, async (req, res) => {
    const input = parseInput(createReceiverSchema, req.body);
    const { workspace } = await authorizeWorkspace(req, req.params.ws, receiverPolicy, 'write');
    const receiver = await addReceiver(sequelize, { workspace, actor: currentUser(req), ...input });
    res.status(201).json({ data: presentReceiver(receiver, { install: null }) });
  });

  router.get('/receivers/:id', signedIn, async (req, res) => {
    const { receiver } = await authorizeReceiver(req, req.params.id, 'read');
    res.json({ data: await presentOnShelf(receiver) });
  });

  router.patch('/receivers/:id', signedIn, async (req, res) => {
    const input = parseInput(updateReceiverSchema, req.body);
    const { receiver: found } = await authorizeReceiver(req, req.params.id, 'write');
    const receiver = await updateReceiver(sequelize, { receiverId: found.id, changes: input, actor: currentUser(req) });
    res.json({ data: await presentOnShelf(receiver) });
  });

  router.get('/receivers/:id/reuse-check', signedIn, async (req, res) => {
    const query = parseInput(reuseQuery, req.query, 'Name the model and the slot to check against.');
    const { receiver } = await authorizeReceiver(req, req.params.id, 'read');
    const model = await modelOnShelf(receiver.workspaceId, query.model);
    const [{ revision, check }, installs, holder] = await Promise.all([
      checkAgainstLatest(receiver, model, query.slot),
      openInstalls([receiver.id]),
      ReceiverInstall.findOne({
        where: { modelId: model.id, slot: query.slot, removedAt: null },
        include: [{ model: Receiver, as: 'receiver', attributes: ['id', 'label'] }],
      }),
    ]);
    res.json({
      data: presentReuseCheck(
        receiver,
        model,
        revision,
        check,
        installs.get(receiver.id) ?? null,
        holder?.receiver ?? null,
      ),
    });
  });

  router.post('/receivers/:id/install', signedIn, async (req, res) => {
    const input = parseInput(installSchema, req.body);
    const { receiver: found } = await authorizeReceiver(req, req.params.id, 'write');
    const model = await modelOnShelf(found.workspaceId, input.model);
    const installed = await installReceiver(sequelize, {
      receiverId: found.id,
      model,
      slot: input.slot,
      actor: currentUser(req),
      move: input.move,
    });
    res.status(201).json({
      data: {
        ...presentReuseCheck(
          installed.receiver,
          model,
          installed.revision,
          installed.check,
          installed.install,
          installed.receiver,
        ),
        receiver: await presentOnShelf(installed.receiver),
        install: presentInstall(installed.install),
        moved_from: installed.previous ? presentInstall(installed.previous) : null,
      },
    });
  });

  router.post('/receivers/:id/remove', signedIn, async (req, res) => {
    const { receiver: found } = await authorizeReceiver(req, req.params.id, 'write');
    const { receiver, install } = await removeReceiver(sequelize, found.id, currentUser(req));
    res.json({ data: { receiver: await presentOnShelf(receiver), install: presentInstall(install) } });
  });

  router.post('/receivers/:id/apply', signedIn, async (req, res) => {
    const input = parseInput(applySchema, req.body);
    const { receiver: found } = await authorizeReceiver(req, req.params.id, 'write');
    const applied = await applyReceiverSettings(sequelize, {
      receiverId: found.id,
      actor: currentUser(req),
      revisionId: input.revision,
    });
    res.json({
      data: {
        ...presentReuseCheck(
          applied.receiver,
          applied.model,
          applied.revision,
          applied.check,
          applied.install,
          applied.receiver,
        ),
        receiver: await presentOnShelf(applied.receiver),
      },
    });
  });

  router.get('/receivers/:id/history', signedIn, async (req, res) => {
    const query = parseInput(historyQuery, req.query, 'The paging parameters are not valid.');
    const { receiver } = await authorizeReceiver(req, req.params.id, 'read');
    const installsPage = { limit: query.limit, offset: query.installs_offset };
    const eventsPage = { limit: query.limit, offset: query.events_offset };
    const [installs, events] = await Promise.all([
      ReceiverInstall.findAndCountAll({
        where: { receiverId: receiver.id },
        include: [
          { model: SetupModel, as: 'model', attributes: ['id', 'name'] },
          { model: User, as: 'installer', attributes: ['id', 'name'] },
          { model: User, as: 'remover', attributes: ['id', 'name'] },
        ],
        order: [
          ['installedAt', 'DESC'],
          ['id', 'DESC'],
        ],
        ...installsPage,
      }),
      AuditEvent.findAndCountAll({
        where: { workspaceId: receiver.workspaceId, subjectType: 'receiver', subjectId: receiver.id },
        include: [{ model: User, as: 'actor', attributes: ['id', 'name'] }],
        // A move ends one stay and begins the next at the same instant: newest first, the arrival leads.
        order: [
          ['createdAt', 'DESC'],
          [literal(`CASE WHEN "AuditEvent"."action" = 'receiver.installed' THEN 0 ELSE 1 END`), 'ASC'],
          ['id', 'DESC'],
        ],
        ...eventsPage,
      }),
    ]);
    res.json({
      data: { installs: installs.rows.map(presentInstall), events: events.rows.map(presentReceiverEvent) },
      pagination: { installs: pagination(installsPage, installs.count), events: pagination(eventsPage, events.count) },
    });
  });

  return router;
}
