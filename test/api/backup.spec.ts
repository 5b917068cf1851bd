// npm run backup / restore: a backup of the test database restored into the scratch database has
// the same rows in every table (sessions excluded) and every advisory PDF with the same SHA-256.
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import { createSequelize } from '../../api/db';
import { backupDatabase, restoreDatabase } from '../../api/scripts/backup-lib';
import { testConfig, testDb } from './support/test-app';

async function counts(sequelize: Sequelize, db: string): Promise<Record<string, number>> {
  const tables = await sequelize.query<{ t: string }>("SELECT table_name AS t FROM information_schema.tables WHERE table_schema = ? AND table_type = 'BASE TABLE' ORDER BY table_name", { replacements: [db], type: QueryTypes.SELECT });
  const out: Record<string, number> = {};
  for (const { t } of tables) {
    if (t === 'sessions') continue;
    out[t] = Number((await sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM \`${t}\``, { type: QueryTypes.SELECT }))[0]!.n);
  }
  return out;
}

async function advisoryHashes(sequelize: Sequelize): Promise<string[]> {
  const rows = await sequelize.query<{ id: number; pdf: Buffer }>('SELECT id, pdf FROM advisories ORDER BY id', { type: QueryTypes.SELECT });
  // hashed here with Node's crypto, independently of the stored sha256 column
  return rows.map((r) => `${r.id}:${createHash('sha256').update(r.pdf).digest('hex')}`);
}

describe('backup and restore', () => {
  it('restores into a scratch database with equal row counts and equal advisory SHA-256s, sessions left out', async () => {
    const { sequelize, config } = await testDb();
    const file = join(mkdtempSync(join(tmpdir(), 'brinkmark-backup-')), 'backup.sql');
    await backupDatabase(config, file);
    const text = readFileSync(file, 'utf8');
    expect(text).toContain('CREATE TABLE `sessions`');
    expect(text).not.toMatch(/INSERT INTO `sessions`/);

    const scratchConfig = testConfig({ DB_NAME: process.env.SCRATCH_DB_NAME ?? 'brinkmark_scratch' });
    const scratch = createSequelize(scratchConfig, { withModels: false });
    try {
      await scratch.getQueryInterface().dropAllTables();
      await restoreDatabase(scratchConfig, file);
      const before = await counts(sequelize, config.DB_NAME);
      const after = await counts(scratch, scratchConfig.DB_NAME);
      expect(Object.keys(before).length).toBeGreaterThan(10);
      expect(after).toEqual(before);
      expect(await advisoryHashes(scratch)).toEqual(await advisoryHashes(sequelize));
      expect(Number((await scratch.query<{ n: number }>('SELECT COUNT(*) AS n FROM sessions', { type: QueryTypes.SELECT }))[0]!.n)).toBe(0);
    } finally {
      await scratch.close();
    }
  });
});
