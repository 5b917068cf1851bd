/** A discrete-generation demo stock (Skerry Reach sand-eel) with its invented spawner/recruit series. */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { QueryInterface } from 'sequelize';
import { parseStockCsv } from '../api/engine/data/csv';

type Ctx = { context: QueryInterface };
const CODE = 'skerry-sand-eel';
const NOTE = 'Demo spawner/recruit series (seeded generator, seeders/stock-recruit-series.ts)';

export async function up({ context: qi }: Ctx): Promise<void> {
  const csv = readFileSync(join(import.meta.dirname, 'data', 'ricker-demo-sr.csv'), 'utf8');
  const parsed = parseStockCsv(csv);
  if (!parsed.ok) throw new Error('seeders/data/ricker-demo-sr.csv is not clean');
  const now = new Date();
  await qi.sequelize.transaction(async (transaction) => {
    const [region] = (await qi.sequelize.query("SELECT id FROM regions WHERE code = 'skerry-reach'", { transaction, type: 'SELECT' })) as { id: number }[];
    const [assessor] = (await qi.sequelize.query("SELECT id FROM users WHERE email = 'tomas.reyl@corran-firth.example'", { transaction, type: 'SELECT' })) as { id: number }[];
    if (!region || !assessor) return;
    await qi.bulkInsert('stocks', [{
      code: CODE, name: 'Skerry Reach sand-eel', kind: 'single', unit: 't', default_model: 'ricker',
      description: 'Spawners and recruits by year class since 1990; one generation a year.', region_id: region.id, created_at: now, updated_at: now,
    }], { transaction });
    const [stock] = (await qi.sequelize.query(`SELECT id FROM stocks WHERE code = '${CODE}'`, { transaction, type: 'SELECT' })) as { id: number }[];
    const s = parsed.series;
    await qi.bulkInsert('datasets', [{
      stock_id: stock!.id, version: 1, note: NOTE, kind: 'single', csv_text: csv, first_year: s.years[0], last_year: s.years[s.years.length - 1],
      index_names: JSON.stringify(['spawners', 'recruits']), created_by: assessor.id, created_at: now,
    }], { transaction });
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    const [stock] = (await qi.sequelize.query(`SELECT id FROM stocks WHERE code = '${CODE}'`, { transaction, type: 'SELECT' })) as { id: number }[];
    if (!stock) return;
    await qi.bulkDelete('datasets', { stock_id: stock.id, note: NOTE }, { transaction });
    await qi.bulkDelete('stocks', { code: CODE }, { transaction });
  });
}
