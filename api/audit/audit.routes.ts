import { Router } from 'express';
import { requireRole } from '../http/auth';
import { listAudit } from './audit.service';

export function auditRoutes(): Router {
  const router = Router();
  router.get('/', requireRole('admin'), async (req, res) => {
    const entityType = typeof req.query.entityType === 'string' ? req.query.entityType : undefined;
    res.json({ events: await listAudit({ entityType }) });
  });
  return router;
}
