/** npm run restore FILE: loads a backup into the configured database (the local demo one unless DB_* are set). */
import { existsSync } from 'node:fs';
import { loadConfig } from '../config';
import { restoreDatabase } from './backup-lib';
import { profile } from './local-env';

const file = process.argv[2];
if (!file || !existsSync(file)) {
  console.error('Usage: npm run restore FILE   (a file written by npm run backup)');
  process.exit(2);
}
const env = process.env.DB_NAME ? process.env : { ...profile('demo').env, ...process.env };
const config = loadConfig(env);
await restoreDatabase(config, file);
console.log(`Restored ${config.DB_NAME} from ${file}. Restart the server; everyone signs in again.`);
