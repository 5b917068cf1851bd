import { Router, type Request, type Response } from 'express';
import { requireRole } from '../http/auth';
import { idParam, validateBody } from '../http/validate';
import { commentSchema, decisionSchema, rulesSchema, voteSchema } from './board.schemas';
import type { BoardService } from './board.service';

/** Mounted at /api/board. */
export function boardRoutes(board: BoardService): Router {
  const router = Router();
  router.get('/proposals', requireRole('board', 'admin'), async (_req, res) => { res.json({ proposals: await board.queue() }); });
  router.get('/rules', requireRole('board', 'admin', 'assessor'), async (_req, res) => { res.json({ rules: await board.rules() }); });
  router.put('/rules', requireRole('admin'), validateBody(rulesSchema), async (req, res) => { res.json({ rules: await board.setRules(req.user!.id, req.body) }); });
  return router;
}

/** Mounted at /api/proposals/:proposalId/board. */
export function proposalBoardRoutes(board: BoardService): Router {
  const pid = (req: Request) => idParam(req.params.proposalId, 'proposalId');
  const router = Router({ mergeParams: true });
  router.get('/', requireRole('assessor', 'board', 'admin'), async (req: Request, res: Response) => { res.json(await board.view(pid(req))); });
  router.post('/comments', requireRole('board', 'assessor'), validateBody(commentSchema), async (req: Request, res: Response) => { res.status(201).json(await board.comment(req.user!, pid(req), req.body)); });
  router.post('/votes', requireRole('board'), validateBody(voteSchema), async (req: Request, res: Response) => { res.status(201).json({ vote: await board.vote(req.user!, pid(req), req.body) }); });
  router.post('/decision', requireRole('board'), validateBody(decisionSchema), async (req: Request, res: Response) => { res.status(201).json(await board.decide(req.user!, pid(req), req.body)); });
  return router;
}
