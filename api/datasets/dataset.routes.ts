import { Router } from 'express';
import multer from 'multer';
import type { Sequelize } from 'sequelize';
import { requireRole } from '../http/auth';
import { validateBody } from '../http/validate';
import { datasetController } from './dataset.controller';
import { createDatasetSchema, MAX_CSV_BYTES } from './dataset.schemas';
import { DatasetService } from './dataset.service';

const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_CSV_BYTES, files: 1 } });

/** Mounted at /api/stocks/:stockId/datasets. */
export function stockDatasetRoutes(sequelize: Sequelize): Router {
  const c = datasetController(new DatasetService(sequelize));
  const router = Router({ mergeParams: true });
  router.get('/', requireRole('assessor', 'board', 'admin'), c.list);
  router.post('/check', requireRole('assessor'), upload.single('file'), c.check);
  router.post('/', requireRole('assessor'), validateBody(createDatasetSchema), c.create);
  return router;
}

/** Mounted at /api/datasets. */
export function datasetRoutes(sequelize: Sequelize): Router {
  const c = datasetController(new DatasetService(sequelize));
  const router = Router();
  router.get('/:id', requireRole('assessor', 'board', 'admin'), c.get);
  router.get('/:id/csv', requireRole('assessor', 'board', 'admin'), c.csv);
  return router;
}
