/**
 * A run's server-sent event stream: the run as stored first, then its worker's progress as the
 * queue reports it, then the run as stored once its job ends. The database is read twice, not polled.
 */
import type { Request, Response } from 'express';
import { HttpError } from '../http/http-error';
import type { RunJobs, RunSignal } from './run-jobs';
import type { RunStreamEvent } from './run.schemas';
import type { RunService } from './run.service';

const FINAL = new Set(['succeeded', 'failed', 'cancelled']);
const HEARTBEAT_MS = 15_000;

export async function streamRun(req: Request, res: Response, id: number, runs: RunService, jobs: RunJobs): Promise<void> {
  if (!(req.get('accept') ?? '').includes('text/event-stream')) throw new HttpError(406, 'EVENT_STREAM_ONLY', 'This address sends server-sent events: ask for text/event-stream.');
  const first = await runs.view(id); // 404 before any event is sent
  res.status(200).set({ 'Content-Type': 'text/event-stream', 'Cache-Control': 'no-cache, no-transform', Connection: 'keep-alive', 'X-Accel-Buffering': 'no' });
  res.flushHeaders();
  const send = (e: RunStreamEvent) => res.write(`event: ${e.type}\ndata: ${JSON.stringify(e)}\n\n`);
  let closed = false;
  let stop = () => {};
  const heartbeat = setInterval(() => res.write(': still here\n\n'), HEARTBEAT_MS);
  const end = () => {
    if (closed) return;
    closed = true;
    clearInterval(heartbeat);
    stop();
    res.end();
  };
  req.on('close', end);
  const sendStored = async () => {
    try {
      const run = await runs.view(id);
      if (closed) return;
      send({ type: 'run', run });
      if (FINAL.has(run.status)) end();
    } catch {
      end(); // the client reconnects and reads again
    }
  };
  try {
    // listen before sending the stored state, so an end between the two is not missed
    stop = await jobs.listen(id, (s: RunSignal) => {
      if (closed) return;
      if (s.type === 'progress') send({ type: 'progress', ...s.progress });
      else void sendStored();
    });
  } catch {
    stop = () => {};
  }
  if (closed) return stop();
  send({ type: 'run', run: first });
  if (FINAL.has(first.status)) return end();
  await sendStored(); // the run may have finished while the listener was being set up
}
