import { Router } from 'express';
import { requireRole, signedIn } from '../http/auth';
import { idParam, validateBody } from '../http/validate';
import { supersedeSchema } from './advisory.schemas';
import type { AdvisoryService } from './advisory.service';

/** Mounted at /api/advisories. */
export function advisoryRoutes(advisories: AdvisoryService): Router {
  const router = Router();
  router.get('/', signedIn(), async (req, res) => {
    const q = typeof req.query.q === 'string' ? req.query.q.slice(0, 100) : undefined;
    res.json({ advisories: await advisories.list(req.user!, q) });
  });
  router.get('/:id', signedIn(), async (req, res) => { res.json({ advisory: await advisories.view(req.user!, idParam(req.params.id)) }); });
  router.get('/:id/pdf', signedIn(), async (req, res) => {
    const a = await advisories.get(req.user!, idParam(req.params.id));
    res.setHeader('X-Content-SHA256', a.sha256);
    res.attachment(`${a.docId}.pdf`).type('application/pdf').send(a.pdf);
  });
  router.post('/:id/supersede', requireRole('board'), validateBody(supersedeSchema), async (req, res) => {
    res.status(201).json({ advisory: await advisories.supersede(req.user!, idParam(req.params.id), req.body) });
  });
  return router;
}
