/** Rewrites seeders/data/<stock>.csv from the seeded generator (npm run seed-series). */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { formatStockCsv } from '../api/engine/data/csv';
import { demoSeries } from './series-generator';

const dir = join(import.meta.dirname, 'data');
mkdirSync(dir, { recursive: true });
for (const [code, series] of Object.entries(demoSeries())) {
  writeFileSync(join(dir, `${code}.csv`), formatStockCsv(series));
  console.log(`wrote seeders/data/${code}.csv (${series.years.length} years)`);
}
