/**
 * What /api/health reports: one named check per dependency (database, queue, mail, …). Features and
 * the job system register their own check; the route runs them all with a time limit.
 */
export type HealthStatus = 'up' | 'degraded' | 'down';

export interface HealthReport {
  status: HealthStatus;
  /** One short sentence a person can act on. */
  detail?: string;
  /** Counts and times that explain the status (e.g. messages waiting, last error). */
  figures?: Record<string, string | number | boolean | null>;
}

export type HealthCheck = () => Promise<HealthReport> | HealthReport;

const CHECK_TIMEOUT_MS = 2000;

/** The checks of one application, in the order they were registered. */
export class HealthRegistry {
  private readonly checks = new Map<string, HealthCheck>();

  /** Adds (or replaces) the check named `name`. */
  register(name: string, check: HealthCheck): void {
    this.checks.set(name, check);
  }

  names(): string[] {
    return [...this.checks.keys()];
  }

  /** Runs every check at once; one that throws or takes longer than 2 s is reported as down. */
  async report(): Promise<{ status: HealthStatus; checks: Record<string, HealthReport> }> {
    const entries = await Promise.all([...this.checks].map(async ([name, check]) => [name, await runCheck(check)] as const));
    const checks = Object.fromEntries(entries);
    const states = entries.map(([, r]) => r.status);
    const status: HealthStatus = states.includes('down') ? 'down' : states.includes('degraded') ? 'degraded' : 'up';
    return { status, checks };
  }
}

async function runCheck(check: HealthCheck): Promise<HealthReport> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<HealthReport>((resolve) => {
    timer = setTimeout(() => resolve({ status: 'down', detail: `No answer within ${CHECK_TIMEOUT_MS / 1000} s.` }), CHECK_TIMEOUT_MS);
  });
  try {
    return await Promise.race([Promise.resolve().then(check), timeout]);
  } catch (err) {
    return { status: 'down', detail: (err as Error).message };
  } finally {
    clearTimeout(timer);
  }
}
