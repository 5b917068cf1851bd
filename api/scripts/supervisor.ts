/**
 * Keeps the processes of `npm start` running: each child (the server, each run worker, …) that exits
 * without being asked is started again after 1 s, 2 s, 4 s … (at most 30 s; back to 1 s after a minute up).
 */
import { type ChildProcess, spawn } from 'node:child_process';

export interface ChildSpec {
  name: string;
  args: string[];
}

export class Supervisor {
  private readonly running = new Map<string, ChildProcess>();
  private stopping = false;

  constructor(private readonly cwd: string, private readonly env: NodeJS.ProcessEnv) {}

  /** Starts a child and keeps it running until stop(). */
  supervise(spec: ChildSpec, delayMs = 1000): void {
    const startedAt = Date.now();
    const child = spawn(process.execPath, spec.args, { cwd: this.cwd, stdio: 'inherit', env: this.env });
    this.running.set(spec.name, child);
    child.on('exit', (code, signal) => {
      if (this.stopping) return;
      const next = Date.now() - startedAt > 60_000 ? 1000 : Math.min(delayMs * 2, 30_000);
      console.error(`${spec.name} stopped (${signal ?? `exit code ${code}`}); starting it again in ${delayMs / 1000} s`);
      setTimeout(() => { if (!this.stopping) this.supervise(spec, next); }, delayMs);
    });
  }

  /** Stops every child with SIGTERM and resolves when all have exited. */
  async stop(): Promise<void> {
    this.stopping = true;
    const children = [...this.running.values()].filter((c) => c.exitCode === null && c.signalCode === null);
    const exited = children.map((c) => new Promise((r) => c.once('exit', r)));
    for (const c of children) c.kill('SIGTERM');
    await Promise.all(exited);
  }
}
