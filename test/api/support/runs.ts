/** Helpers for run specs: wait on what the API reports, never sleep blindly. */
import type { SignedIn } from './test-app';

export async function waitForRun(who: SignedIn, id: number, until: (run: { status: string; progress: number }) => boolean, timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await who.agent.get(`/api/runs/${id}`).expect(200);
    if (until(res.body.run)) return res.body as { run: { status: string; progress: number; error: string | null; durationMs: number | null; engineVersion: string; options: Record<string, unknown> }; results: Record<string, unknown> | null };
    if (Date.now() > deadline) throw new Error(`run ${id} stayed ${res.body.run.status}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

export const finished = (r: { status: string }) => ['succeeded', 'failed', 'cancelled'].includes(r.status);
