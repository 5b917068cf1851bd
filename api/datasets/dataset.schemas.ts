/** Contract of the datasets API: shared with the client through `import type`. */
import { z } from 'zod';
import type { CsvProblem } from '../engine/data/csv';
import type { StockSeries } from '../engine/data/series';

export const MAX_CSV_BYTES = 256 * 1024;

export const csvBodySchema = z.object({
  csv: z.string().min(1, 'the file is empty').max(MAX_CSV_BYTES, 'the file is larger than 256 kB'),
}).strict();

export const createDatasetSchema = z.object({
  csv: z.string().min(1, 'the file is empty').max(MAX_CSV_BYTES, 'the file is larger than 256 kB'),
  note: z.string().trim().min(3, 'say in a few words what this version is').max(500),
}).strict();

export interface DatasetView {
  id: number;
  stockId: number;
  version: number;
  note: string;
  kind: 'single' | 'predator-prey';
  firstYear: number;
  lastYear: number;
  indexNames: string[];
  createdBy: number;
  createdByName: string | null;
  createdAt: string;
}

/** The answer of the check endpoint: the parsed table, or every problem. */
export type CsvCheck =
  | { ok: true; kind: 'single' | 'predator-prey'; series: StockSeries; header: string[]; rows: string[][] }
  | { ok: false; errors: CsvProblem[]; header: string[]; rows: string[][] };

export type { CsvProblem, StockSeries };
