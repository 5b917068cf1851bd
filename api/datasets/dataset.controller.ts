import type { Request, Response } from 'express';
import { ValidationError } from '../http/http-error';
import { pageParams } from '../http/paging';
import { idParam } from '../http/validate';
import { MAX_CSV_BYTES } from './dataset.schemas';
import type { DatasetService } from './dataset.service';

/** The CSV text of a request: an uploaded file (multipart field "file") or a JSON body {csv}. */
function csvOf(req: Request): string {
  if (req.file) {
    const text = req.file.buffer.toString('utf8');
    if (text.includes('\u0000')) throw new ValidationError('The file is not a text CSV file.', { file: ['binary content'] });
    return text;
  }
  const csv = (req.body as { csv?: unknown })?.csv;
  if (typeof csv !== 'string' || csv.length === 0) throw new ValidationError('Send a CSV file (field "file") or a JSON body with "csv".', { file: ['missing'] });
  if (Buffer.byteLength(csv) > MAX_CSV_BYTES) throw new ValidationError('The file is larger than 256 kB.', { csv: ['too large'] });
  return csv;
}

export function datasetController(datasets: DatasetService) {
  return {
    list: async (req: Request, res: Response) => {
      res.json(await datasets.list(idParam(req.params.stockId, 'stockId'), pageParams(req.query)));
    },
    check: async (req: Request, res: Response) => {
      idParam(req.params.stockId, 'stockId');
      res.json(await datasets.check(csvOf(req)));
    },
    create: async (req: Request, res: Response) => {
      const body = req.body as { csv: string; note: string };
      res.status(201).json({ dataset: await datasets.create(req.user!.id, idParam(req.params.stockId, 'stockId'), body.csv, body.note) });
    },
    get: async (req: Request, res: Response) => {
      const { dataset, check } = await datasets.get(idParam(req.params.id));
      res.json({ dataset, check });
    },
    csv: async (req: Request, res: Response) => {
      const { dataset, csv } = await datasets.get(idParam(req.params.id));
      res.attachment(`stock-${dataset.stockId}-v${dataset.version}.csv`).type('text/csv').send(csv);
    },
  };
}
