import { Router, type Request, type Response } from 'express';
import type { Sequelize } from 'sequelize';
import { requireRole } from '../http/auth';
import { pageParams } from '../http/paging';
import { idParam, validateBody } from '../http/validate';
import type { RunJobs } from './run-jobs';
import { streamRun } from './run-stream';
import { startRunSchema } from './run.schemas';
import { RunService } from './run.service';

export interface RunRouteDeps {
  jobs: RunJobs;
  limitPerUser: number;
}

function controller(runs: RunService, jobs: RunJobs) {
  return {
    events: (req: Request, res: Response) => streamRun(req, res, idParam(req.params.id), runs, jobs),
    start: async (req: Request, res: Response) => { res.status(202).json({ run: await runs.start(req.user!.id, req.body) }); },
    get: async (req: Request, res: Response) => { res.json(await runs.get(idParam(req.params.id))); },
    list: async (req: Request, res: Response) => { res.json(await runs.listForStock(idParam(req.params.stockId, 'stockId'), pageParams(req.query))); },
    cancel: async (req: Request, res: Response) => { res.json({ run: await runs.cancel(req.user!.id, idParam(req.params.id)) }); },
  };
}

/** Mounted at /api/runs. */
export function runRoutes(sequelize: Sequelize, { jobs, limitPerUser }: RunRouteDeps): Router {
  const c = controller(new RunService(sequelize, jobs, limitPerUser), jobs);
  const router = Router();
  router.post('/', requireRole('assessor'), validateBody(startRunSchema), c.start);
  router.get('/:id', requireRole('assessor', 'board', 'admin'), c.get);
  router.get('/:id/events', requireRole('assessor', 'board', 'admin'), c.events);
  router.post('/:id/cancel', requireRole('assessor'), c.cancel);
  return router;
}

/** Mounted at /api/stocks/:stockId/runs. */
export function stockRunRoutes(sequelize: Sequelize, { jobs, limitPerUser }: RunRouteDeps): Router {
  const c = controller(new RunService(sequelize, jobs, limitPerUser), jobs);
  const router = Router({ mergeParams: true });
  router.get('/', requireRole('assessor', 'board', 'admin'), c.list);
  return router;
}
