import { QueryTypes } from 'sequelize';
import { createSequelize, demoSeeder, schemaMigrator } from '../../api/db';
import { testConfig } from './support/test-app';

// Runs on its own scratch database (created by the test script), never the shared test data.
describe('migrations', () => {
  const config = testConfig({ DB_NAME: process.env.SCRATCH_DB_NAME ?? 'brinkmark_scratch' });

  it('run twice without error, undo completely, and apply again', async () => {
    const sequelize = createSequelize(config, { withModels: false });
    try {
      await sequelize.getQueryInterface().dropAllTables();
      const first = await schemaMigrator(sequelize).up();
      const second = await schemaMigrator(sequelize).up();
      expect(first.length).toBeGreaterThan(0);
      expect(second).toEqual([]);
      await demoSeeder(sequelize).up();
      expect(await demoSeeder(sequelize).up()).toEqual([]);

      await demoSeeder(sequelize).down({ to: 0 });
      const users = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM users', { type: QueryTypes.SELECT });
      expect(Number(users[0]!.n)).toBe(0);

      await schemaMigrator(sequelize).down({ to: 0 });
      const tables = await sequelize.query<{ t: string }>(
        "SELECT table_name AS t FROM information_schema.tables WHERE table_schema = ? AND table_name <> 'migrations_meta' AND table_name <> 'seeders_meta'",
        { replacements: [config.DB_NAME], type: QueryTypes.SELECT },
      );
      expect(tables).toEqual([]);
      expect((await schemaMigrator(sequelize).up()).length).toBe(first.length);
    } finally {
      await sequelize.close();
    }
  });
});
