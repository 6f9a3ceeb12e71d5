import { Router } from 'express';
import type pg from 'pg';
import { pingDatabase } from './health.repository';

/** Liveness plus a database ping, so a load balancer sees when PostgreSQL is away. */
export function healthRoutes(pool: pg.Pool) {
  const router = Router();
  router.get('/', async (_req, res) => {
    const started = Date.now();
    try {
      await pingDatabase(pool, 2000);
      res.json({ status: 'ok', database: 'up', databaseMs: Date.now() - started });
    } catch {
      res.status(503).json({ status: 'degraded', database: 'down' });
    }
  });
  return router;
}
