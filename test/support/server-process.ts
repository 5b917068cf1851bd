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

/** Spawns a run worker process (api/worker.ts); resolves once it says it is taking runs. */
export async function spawnWorker(env: NodeJS.ProcessEnv = {}): Promise<{ pid: number; stop(signal?: NodeJS.Signals): Promise<void> }> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'api/worker.ts'], {
    cwd: ROOT, env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'inherit'],
  });
  const exited = new Promise<void>((r) => child.once('exit', () => r()));
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('the run worker did not start')), 30_000);
    let out = '';
    child.stdout!.on('data', (d: Buffer) => {
      out += d.toString();
      if (out.includes('is taking runs')) { clearTimeout(timer); resolve(); }
    });
    child.once('exit', (code) => { clearTimeout(timer); reject(new Error(`the run worker exited with code ${code}`)); });
  });
  child.stdout!.resume();
  return {
    pid: child.pid!,
    stop: async (signal: NodeJS.Signals = 'SIGTERM') => {
      if (child.exitCode === null && child.signalCode === null) child.kill(signal);
      await exited;
    },
  };
}
