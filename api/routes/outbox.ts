import { Router } from 'express';
import { Op } from 'sequelize';
import { z } from 'zod';
import type { AppContext } from '../context';
import { NotFound } from '../errors';
import { authenticate, currentUser } from '../middleware/authenticate';
import { OutboxMessage } from '../models';
import { presentOutboxMessage } from '../presenters/outbox';
import { parseInput } from '../validation';
import { pageInput, pagination } from './paging';

// `to` is gone: asking for another address's mail is refused as an unknown parameter.
const outboxQuery = z.strictObject(pageInput(50).shape);

/**
 * The mail the local mail server caught for the signed-in account's own address. It
 * exists only while that server is in use (development and the demo); with a real SMTP
 * host there is no outbox to read. It stands in for the account's inbox and never shows
 * anyone else's mail: a reset or invitation link is a credential.
 */
export function outboxRouter(context: AppContext): Router {
  const router = Router();

  router.get(
    '/outbox',
    (req, _res, next) => {
      if (!context.mail?.outboxEnabled)
        throw new NotFound(`There is no ${req.method} ${req.baseUrl}${req.path}.`, { code: 'no-such-route' });
      next();
    },
    authenticate(context.config),
    async (req, res) => {
      const { limit, offset } = parseInput(outboxQuery, req.query, 'The paging parameters are not valid.');
      const { rows, count } = await OutboxMessage.findAndCountAll({
        where: { envelopeTo: { [Op.contains]: [currentUser(req).email] }, receivedAt: { [Op.ne]: null } },
        order: [
          ['queuedAt', 'DESC'],
          ['id', 'DESC'],
        ],
        limit,
        offset,
      });
      res.json({ data: rows.map(presentOutboxMessage), pagination: pagination({ limit, offset }, count) });
    },
  );

  return router;
}
