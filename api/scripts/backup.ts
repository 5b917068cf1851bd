/** npm run backup [FILE]: a backup of the configured database (the local demo one unless DB_* are set). */
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { loadConfig } from '../config';
import { backupDatabase } from './backup-lib';
import { DATA, profile } from './local-env';

const env = process.env.DB_NAME ? process.env : { ...profile('demo').env, ...process.env };
const config = loadConfig(env);
const dir = join(DATA, 'backups');
mkdirSync(dir, { recursive: true });
const file = process.argv[2] ?? join(dir, `${config.DB_NAME}-${new Date().toISOString().replace(/[:.]/g, '-')}.sql`);
await backupDatabase(config, file);
console.log(`Backup of ${config.DB_NAME} written to ${file}`);
