import { Router } from 'express';
import { pingDatabase, type Db } from '@bumperline/db/client';

/** Liveness with the database: 503 while it cannot be reached, ok again as soon as it can. */
export function healthRouter(db: Db): Router {
  const r = Router();
  r.get('/', async (_req, res) => {
    try {
      await pingDatabase(db);
      res.json({ status: 'ok', db: 'ok' });
    } catch {
      res.status(503).type('application/problem+json').json({
        type: 'https://bumperline.example/problems/unavailable',
        title: 'Service unavailable',
        status: 503,
        detail: 'The database is not reachable.',
        db: 'down',
        instance: '/api/health',
      });
    }
  });
  return r;
}
