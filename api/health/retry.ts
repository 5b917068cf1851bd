/** Background writes that must land even across a database outage (a run's outcome, an outbox state). */
import { isDatabaseUnavailable } from './database-state';

export interface RetryOptions {
  /** Give up after this long (the write is logged as lost). */
  forMs?: number;
  /** What the write is, for the log. */
  label: string;
}

/**
 * Runs `write`, and while it fails because the database is unreachable, again after 0.5 s, 1 s, 2 s …
 * (at most 5 s apart) until it succeeds or `forMs` has passed. Any other error is thrown at once.
 */
export async function whileDatabaseAway<T>(write: () => Promise<T>, { forMs = 15 * 60_000, label }: RetryOptions): Promise<T> {
  const deadline = Date.now() + forMs;
  let wait = 500;
  let logged = false;
  for (;;) {
    try {
      const result = await write();
      if (logged) console.error(`${label}: written after the database came back`);
      return result;
    } catch (err) {
      if (!isDatabaseUnavailable(err) || Date.now() + wait > deadline) throw err;
      if (!logged) console.error(`${label}: the database is away, retrying (${(err as Error).message})`);
      logged = true;
      await new Promise((r) => setTimeout(r, wait));
      wait = Math.min(wait * 2, 5000);
    }
  }
}

/** Logs a background failure instead of letting it become an unhandled rejection. */
export function logFailure(label: string): (err: unknown) => void {
  return (err) => console.error(`${label} failed: ${(err as Error)?.message ?? String(err)}`);
}
