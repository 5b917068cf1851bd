import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { publicRoute } from '../http/auth';
import type { HealthRegistry } from './health';

/** The database check: one trivial query on the pool (a lost connection is replaced by the pool on the next try). */
export function databaseCheck(sequelize: Sequelize) {
  return async () => {
    const started = Date.now();
    try {
      await sequelize.query('SELECT 1');
      return { status: 'up' as const, figures: { latencyMs: Date.now() - started } };
    } catch (err) {
      return { status: 'down' as const, detail: `The database does not answer: ${(err as Error).message}` };
    }
  };
}

/** Mounted at /api/health: the state of each dependency; 503 when any is down, so a proxy can stop routing here. */
export function healthRoutes(registry: HealthRegistry): Router {
  const router = Router();
  router.get('/', publicRoute(), async (_req, res) => {
    const report = await registry.report();
    res.status(report.status === 'down' ? 503 : 200).json(report);
  });
  return router;
}
