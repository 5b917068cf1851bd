import { Router } from 'express';
import { signedIn } from '../http/auth';
import { Region } from './region.model';

export function regionRoutes(): Router {
  const router = Router();
  router.get('/', signedIn(), async (_req, res) => {
    const regions = await Region.findAll({ order: [['name', 'ASC']] });
    res.json({ regions: regions.map((r) => ({ id: r.id, code: r.code, name: r.name, description: r.description })) });
  });
  return router;
}
