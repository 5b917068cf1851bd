/**
 * A private MariaDB server on loopback, owned by the project: installed from Debian when missing,
 * initialised in a git-ignored data directory, started with its own port, socket and pid file.
 */
import { execFileSync, spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { ensureDebianPackages } from './debian';

export interface MariaDbServer {
  datadir: string;
  port: number;
  socket: string;
}

/** Describes the server for a data directory; the socket lives in /tmp because socket paths are short. */
export function mariaDbServer(datadir: string, port: number): MariaDbServer {
  const abs = resolve(datadir);
  const tag = createHash('sha1').update(abs).digest('hex').slice(0, 10);
  return { datadir: abs, port, socket: join(tmpdir(), `brinkmark-${tag}.sock`) };
}

function client(server: MariaDbServer, args: string[]): string {
  return execFileSync('mariadb', ['--no-defaults', `--socket=${server.socket}`, '-uroot', ...args], {
    encoding: 'utf8',
    stdio: ['ignore', 'pipe', 'pipe'],
  });
}

function ping(server: MariaDbServer): boolean {
  try {
    execFileSync('mariadb-admin', ['--no-defaults', `--socket=${server.socket}`, '-uroot', 'ping'], {
      stdio: 'ignore',
    });
    return true;
  } catch {
    return false;
  }
}

/** Installs (if needed), initialises (if needed) and starts the server; resolves once it answers. */
export async function startMariaDb(server: MariaDbServer): Promise<void> {
  ensureDebianPackages([{ command: 'mariadbd', path: '/usr/sbin/mariadbd', pkg: 'mariadb-server' }]);
  if (ping(server)) return;
  if (!existsSync(join(server.datadir, 'mysql'))) {
    mkdirSync(server.datadir, { recursive: true });
    execFileSync(
      'mariadb-install-db',
      ['--no-defaults', '--user=root', `--datadir=${server.datadir}`,
        '--auth-root-authentication-method=socket', '--skip-test-db'],
      { stdio: 'ignore' },
    );
  }
  const child = spawn(
    '/usr/sbin/mariadbd',
    ['--no-defaults', '--user=root', `--datadir=${server.datadir}`, '--bind-address=127.0.0.1',
      `--port=${server.port}`, `--socket=${server.socket}`, `--pid-file=${join(server.datadir, 'mysqld.pid')}`,
      `--log-error=${join(server.datadir, 'error.log')}`, '--skip-name-resolve', '--skip-log-bin',
      '--character-set-server=utf8mb4', '--collation-server=utf8mb4_unicode_ci'],
    { detached: true, stdio: 'ignore' },
  );
  child.unref();
  const deadline = Date.now() + 30_000;
  while (Date.now() < deadline) {
    if (ping(server)) return;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`MariaDB did not start on port ${server.port}; see ${join(server.datadir, 'error.log')}`);
}

/** Creates the database and its TCP user (idempotent). `fresh` drops the database first. */
export function ensureDatabase(
  server: MariaDbServer,
  db: { name: string; user: string; password: string },
  fresh = false,
): void {
  const ident = /^[A-Za-z0-9_]+$/;
  if (!ident.test(db.name) || !ident.test(db.user)) throw new Error('database and user names must be plain identifiers');
  const pw = db.password.replace(/\\/g, '\\\\').replace(/'/g, "\\'");
  const sql = [
    fresh ? `DROP DATABASE IF EXISTS \`${db.name}\`;` : '',
    `CREATE DATABASE IF NOT EXISTS \`${db.name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`,
    `CREATE USER IF NOT EXISTS '${db.user}'@'127.0.0.1' IDENTIFIED BY '${pw}';`,
    `ALTER USER '${db.user}'@'127.0.0.1' IDENTIFIED BY '${pw}';`,
    `GRANT ALL PRIVILEGES ON \`${db.name}\`.* TO '${db.user}'@'127.0.0.1';`,
    'FLUSH PRIVILEGES;',
  ].join(' ');
  client(server, ['-e', sql]);
}

/** Shuts the server down cleanly if it is running. */
export function stopMariaDb(server: MariaDbServer): void {
  if (!ping(server)) return;
  execFileSync('mariadb-admin', ['--no-defaults', `--socket=${server.socket}`, '-uroot', 'shutdown'], {
    stdio: 'ignore',
  });
}
