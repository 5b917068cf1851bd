import bcrypt from 'bcrypt';
import { Op, QueryInterface } from 'sequelize';
import { DEMO_PASSWORD, DEMO_PEOPLE, DEMO_REGIONS, DEMO_STOCKS } from './demo-people';

type Ctx = { context: QueryInterface };

export async function up({ context: qi }: Ctx): Promise<void> {
  const now = new Date();
  const stamps = { created_at: now, updated_at: now };
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  await qi.sequelize.transaction(async (transaction) => {
    await qi.bulkInsert('regions', DEMO_REGIONS.map((r) => ({ ...r, ...stamps })), { transaction });
    const rows = (await qi.sequelize.query('SELECT id, code FROM regions', { transaction, type: 'SELECT' })) as { id: number; code: string }[];
    const regionId = new Map(rows.map((r) => [r.code, r.id]));
    await qi.bulkInsert('stocks', DEMO_STOCKS.map((s) => ({
      code: s.code, name: s.name, kind: s.kind, unit: s.unit, default_model: s.defaultModel,
      description: s.description, region_id: regionId.get(s.region), ...stamps,
    })), { transaction });
    await qi.bulkInsert('users', DEMO_PEOPLE.map((p) => ({
      email: p.email, name: p.name, role: p.role, organisation: p.organisation, password_hash: hash,
      region_id: p.region ? regionId.get(p.region) : null, active: true, ...stamps,
    })), { transaction });
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.bulkDelete('users', { email: { [Op.in]: DEMO_PEOPLE.map((p) => p.email) } }, { transaction });
    await qi.bulkDelete('stocks', { code: { [Op.in]: DEMO_STOCKS.map((s) => s.code) } }, { transaction });
    await qi.bulkDelete('regions', { code: { [Op.in]: DEMO_REGIONS.map((r) => r.code) } }, { transaction });
  });
}
