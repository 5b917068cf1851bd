import { Router } from 'express';
import { signedIn } from '../http/auth';
import { idParam } from '../http/validate';
import { getStock, listStocks } from './stock.service';

export function stockRoutes(): Router {
  const router = Router();
  router.get('/', signedIn(), async (req, res) => {
    res.json({ stocks: await listStocks(req.user!) });
  });
  router.get('/:id', signedIn(), async (req, res) => {
    res.json({ stock: await getStock(req.user!, idParam(req.params.id)) });
  });
  return router;
}
