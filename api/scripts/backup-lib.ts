/**
 * Backups of the configured database with mariadb-dump --single-transaction (a consistent snapshot
 * without locking writers). Sessions are left out (only the table's shape is kept): they are
 * short-lived and restoring them would revive signed-out sessions.
 */
import { spawn } from 'node:child_process';
import { createReadStream, createWriteStream } from 'node:fs';
import type { Config } from '../config';

function clientArgs(config: Config): string[] {
  return ['--no-defaults', `--host=${config.DB_HOST}`, `--port=${config.DB_PORT}`, `--user=${config.DB_USER}`];
}

// why: the password goes in the environment, not on a command line other users can read
const clientEnv = (config: Config) => ({ ...process.env, MYSQL_PWD: config.DB_PASSWORD });

function run(cmd: string, args: string[], config: Config, io: { out?: NodeJS.WritableStream; in?: NodeJS.ReadableStream }): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { env: clientEnv(config), stdio: [io.in ? 'pipe' : 'ignore', io.out ? 'pipe' : 'ignore', 'pipe'] });
    let stderr = '';
    child.stderr!.on('data', (c: Buffer) => { stderr += c.toString(); });
    if (io.out) child.stdout!.pipe(io.out, { end: false });
    if (io.in) io.in.pipe(child.stdin!);
    child.on('error', reject);
    child.on('close', (code) => (code === 0 ? resolve() : reject(new Error(`${cmd} exited with ${code}: ${stderr.trim()}`))));
  });
}

/** Writes a full backup of the configured database (sessions as an empty table) to `file`. */
export async function backupDatabase(config: Config, file: string): Promise<void> {
  const out = createWriteStream(file, { mode: 0o600 });
  const common = [...clientArgs(config), '--single-transaction', '--routines', '--triggers', '--hex-blob', '--default-character-set=utf8mb4'];
  try {
    await run('mariadb-dump', [...common, `--ignore-table=${config.DB_NAME}.sessions`, config.DB_NAME], config, { out });
    await run('mariadb-dump', [...common, '--no-data', config.DB_NAME, 'sessions'], config, { out });
  } finally {
    await new Promise((r) => out.end(r));
  }
}

/** Loads a backup into the configured database (tables in the file replace those of the same name). */
export async function restoreDatabase(config: Config, file: string): Promise<void> {
  await run('mariadb', [...clientArgs(config), '--default-character-set=utf8mb4', config.DB_NAME], config, { in: createReadStream(file) });
}
