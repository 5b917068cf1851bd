import { Router } from 'express';
import { signedIn } from '../http/auth';
import { pageParams } from '../http/paging';
import { idParam } from '../http/validate';
import { getStock, listStocks } from './stock.service';

export function stockRoutes(): Router {
  const router = Router();
  router.get('/', signedIn(), async (req, res) => {
    res.json(await listStocks(req.user!, pageParams(req.query, { defaultLimit: 100 })));
  });
  router.get('/:id', signedIn(), async (req, res) => {
    res.json({ stock: await getStock(req.user!, idParam(req.params.id)) });
  });
  return router;
}
