import { Router, type Request, type Response } from 'express';
import type { Sequelize } from 'sequelize';
import { requireRole } from '../http/auth';
import { pageParams } from '../http/paging';
import { idParam, validateBody } from '../http/validate';
import type { RunQueue } from './run-queue';
import { startRunSchema } from './run.schemas';
import { RunService } from './run.service';

function controller(runs: RunService) {
  return {
    start: async (req: Request, res: Response) => { res.status(202).json({ run: await runs.start(req.user!.id, req.body) }); },
    get: async (req: Request, res: Response) => { res.json(await runs.get(idParam(req.params.id))); },
    list: async (req: Request, res: Response) => { res.json(await runs.listForStock(idParam(req.params.stockId, 'stockId'), pageParams(req.query))); },
    cancel: async (req: Request, res: Response) => { res.json({ run: await runs.cancel(req.user!.id, idParam(req.params.id)) }); },
  };
}

/** Mounted at /api/runs. */
export function runRoutes(sequelize: Sequelize, queue: RunQueue): Router {
  const c = controller(new RunService(sequelize, queue));
  const router = Router();
  router.post('/', requireRole('assessor'), validateBody(startRunSchema), c.start);
  router.get('/:id', requireRole('assessor', 'board', 'admin'), c.get);
  router.post('/:id/cancel', requireRole('assessor'), c.cancel);
  return router;
}

/** Mounted at /api/stocks/:stockId/runs. */
export function stockRunRoutes(sequelize: Sequelize, queue: RunQueue): Router {
  const c = controller(new RunService(sequelize, queue));
  const router = Router({ mergeParams: true });
  router.get('/', requireRole('assessor', 'board', 'admin'), c.list);
  return router;
}
