import { Router } from 'express';
import type { AppContext } from '../context';

export function healthRouter({ sequelize }: AppContext): Router {
  const router = Router();

  router.get('/health', async (_req, res) => {
    res.set('Cache-Control', 'no-store');
    try {
      await sequelize.query('SELECT 1');
      res.json({ data: { status: 'ok', database: 'up' } });
    } catch {
      res.status(503).json({ data: { status: 'unavailable', database: 'down' } });
    }
  });

  return router;
}
