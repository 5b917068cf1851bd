/**
 * A private Redis on loopback for the run queue (BullMQ): installed from Debian when missing, started
 * with its own port, data folder and pid file, append-only so queued jobs survive a restart.
 */
import { execFileSync, spawn } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { ensureDebianPackages } from './debian';

export interface RedisServer {
  dir: string;
  port: number;
}

export function redisServer(dir: string, port: number): RedisServer {
  return { dir: resolve(dir), port };
}

function cli(server: RedisServer, args: string[]): string {
  return execFileSync('redis-cli', ['-h', '127.0.0.1', '-p', String(server.port), ...args], {
    encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'], timeout: 5_000,
  }).trim();
}

/** True when this server answers PING. */
export function redisAnswers(server: RedisServer): boolean {
  try {
    return cli(server, ['ping']) === 'PONG';
  } catch {
    return false;
  }
}

/** Installs (if needed) and starts the server; resolves once it answers. `fresh` empties it. */
export async function startRedis(server: RedisServer, { fresh = false } = {}): Promise<void> {
  ensureDebianPackages([{ command: 'redis-server', path: '/usr/bin/redis-server', pkg: 'redis-server' }]);
  if (!redisAnswers(server)) {
    mkdirSync(server.dir, { recursive: true });
    const child = spawn('/usr/bin/redis-server', [
      '--port', String(server.port), '--bind', '127.0.0.1', '--dir', server.dir,
      '--pidfile', join(server.dir, 'redis.pid'), '--logfile', join(server.dir, 'redis.log'),
      '--appendonly', 'yes', '--save', '', '--maxmemory-policy', 'noeviction', '--protected-mode', 'yes',
    ], { detached: true, stdio: 'ignore' });
    child.unref();
    const deadline = Date.now() + 20_000;
    while (!redisAnswers(server)) {
      if (Date.now() > deadline) throw new Error(`Redis did not start on port ${server.port}; see ${join(server.dir, 'redis.log')}`);
      await new Promise((r) => setTimeout(r, 100));
    }
  }
  if (fresh) cli(server, ['flushall']);
}

/** Shuts the server down if it is running (its append-only file keeps the queue). */
export function stopRedis(server: RedisServer): void {
  if (!redisAnswers(server)) return;
  try {
    cli(server, ['shutdown']);
  } catch {
    // the connection closes as the server exits
  }
}
