import { Router } from 'express';
import { Op } from 'sequelize';
import { z } from 'zod';
import type { AppContext } from '../context';
import { NotFound } from '../errors';
import { authenticate } from '../middleware/authenticate';
import { OutboxMessage } from '../models';
import { presentOutboxMessage } from '../presenters/outbox';
import { parseInput } from '../validation';
import { pageSchema } from './team-inputs';

const outboxQuery = pageSchema.extend({
  to: z
    .string({ error: 'to is an e-mail address.' })
    .trim()
    .toLowerCase()
    .max(254, 'to is an e-mail address.')
    .optional(),
});

/**
 * The mail the local mail server caught. It exists only while that server is in use
 * (development and the demo); with a real SMTP host there is no outbox to read.
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
      const { limit, offset, to } = parseInput(outboxQuery, req.query, 'The paging parameters are not valid.');
      const where = to ? { envelopeTo: { [Op.contains]: [to] } } : {};
      const { rows, count } = await OutboxMessage.findAndCountAll({
        where,
        order: [
          ['receivedAt', 'DESC'],
          ['id', 'DESC'],
        ],
        limit,
        offset,
      });
      res.json({ data: rows.map(presentOutboxMessage), pagination: { limit, offset, total: count } });
    },
  );

  return router;
}
