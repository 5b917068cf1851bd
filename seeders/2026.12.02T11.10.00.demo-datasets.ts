import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { Op, QueryInterface } from 'sequelize';
import { parseStockCsv } from '../api/engine/data/csv';
import { DEMO_STOCKS } from './demo-people';

type Ctx = { context: QueryInterface };
const NOTE = 'Demo series (seeded generator, seeders/series-generator.ts)';

export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    const [assessor] = (await qi.sequelize.query("SELECT id FROM users WHERE email = 'tomas.reyl@corran-firth.example'", { transaction, type: 'SELECT' })) as { id: number }[];
    const stocks = (await qi.sequelize.query('SELECT id, code FROM stocks', { transaction, type: 'SELECT' })) as { id: number; code: string }[];
    const rows = DEMO_STOCKS.map((s) => {
      const csv = readFileSync(join(import.meta.dirname, 'data', `${s.code}.csv`), 'utf8');
      const parsed = parseStockCsv(csv);
      if (!parsed.ok) throw new Error(`seeders/data/${s.code}.csv is not clean`);
      const series = parsed.series;
      return {
        stock_id: stocks.find((x) => x.code === s.code)!.id, version: 1, note: NOTE, kind: parsed.kind, csv_text: csv,
        first_year: series.years[0], last_year: series.years[series.years.length - 1],
        index_names: JSON.stringify(series.indices.map((i) => i.name)), created_by: assessor!.id, created_at: new Date(),
      };
    });
    await qi.bulkInsert('datasets', rows, { transaction });
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.bulkDelete('datasets', { note: { [Op.eq]: NOTE }, version: 1 });
}
