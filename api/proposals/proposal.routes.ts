import { Router, type Request, type Response } from 'express';
import type { Sequelize } from 'sequelize';
import type { MailSender } from '../mail/mail-sender';
import { requireRole } from '../http/auth';
import { idParam, validateBody } from '../http/validate';
import { createProposalSchema, updateProposalSchema } from './proposal.schemas';
import { ProposalService } from './proposal.service';

function controller(proposals: ProposalService) {
  return {
    create: async (req: Request, res: Response) => { res.status(201).json({ proposal: await proposals.create(req.user!.id, req.body) }); },
    update: async (req: Request, res: Response) => { res.json({ proposal: await proposals.update(req.user!.id, idParam(req.params.id), req.body) }); },
    submit: async (req: Request, res: Response) => { res.json({ proposal: await proposals.submit(req.user!.id, idParam(req.params.id)) }); },
    revise: async (req: Request, res: Response) => { res.status(201).json({ proposal: await proposals.revise(req.user!.id, idParam(req.params.id)) }); },
    get: async (req: Request, res: Response) => { res.json({ proposal: await proposals.get(idParam(req.params.id)) }); },
    list: async (req: Request, res: Response) => { res.json({ proposals: await proposals.listForStock(idParam(req.params.stockId, 'stockId'), req.user!) }); },
  };
}

/** Mounted at /api/proposals. */
export function proposalRoutes(sequelize: Sequelize, mail: MailSender, publicUrl: string): Router {
  const c = controller(new ProposalService(sequelize, mail, publicUrl));
  const router = Router();
  router.post('/', requireRole('assessor'), validateBody(createProposalSchema), c.create);
  router.get('/:id', requireRole('assessor', 'board', 'admin'), c.get);
  router.patch('/:id', requireRole('assessor'), validateBody(updateProposalSchema), c.update);
  router.post('/:id/submit', requireRole('assessor'), c.submit);
  router.post('/:id/revise', requireRole('assessor'), c.revise);
  return router;
}

/** Mounted at /api/stocks/:stockId/proposals. */
export function stockProposalRoutes(sequelize: Sequelize): Router {
  const c = controller(new ProposalService(sequelize));
  const router = Router({ mergeParams: true });
  router.get('/', requireRole('assessor', 'board', 'admin'), c.list);
  return router;
}
