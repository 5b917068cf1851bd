/** Runs the real server process (api/server.ts) for tests: started with its env, answered, stopped. */
import { spawn } from 'node:child_process';
import { resolve } from 'node:path';

const ROOT = resolve(import.meta.dirname, '..', '..');

export interface RunningServer {
  base: string;
  stop(): Promise<void>;
}

/** Spawns the server on a port and resolves once it answers; stderr is shown so a failed start says why. */
export async function spawnServer(port: number, env: NodeJS.ProcessEnv = {}): Promise<RunningServer> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'api/server.ts'], {
    cwd: ROOT, env: { ...process.env, ...env, PORT: String(port) }, stdio: ['ignore', 'ignore', 'inherit'],
  });
  const base = `http://127.0.0.1:${port}`;
  const stop = async () => {
    const exited = new Promise((r) => child.once('exit', r));
    child.kill('SIGTERM');
    await exited;
  };
  const deadline = Date.now() + 30_000;
  for (;;) {
    try {
      if ((await fetch(`${base}/api/auth/csrf`)).ok) return { base, stop };
    } catch { /* not listening yet */ }
    if (Date.now() > deadline) {
      child.kill('SIGKILL');
      throw new Error(`the server did not start on port ${port}`);
    }
    await new Promise((r) => setTimeout(r, 100));
  }
}
