// The run queue as people see it: the per-person limit, fair order, the event stream, cancel.
import type { Express } from 'express';
import { Dataset } from '../../api/datasets/dataset.model';
import { priorityFor } from '../../api/runs/run-jobs';
import { Run } from '../../api/runs/run.model';
import { Stock } from '../../api/stocks/stock.model';
import { finished, waitForRun } from './support/runs';
import { signIn, testApp, type SignedIn } from './support/test-app';
import { specPerson } from './support/users';

/** Reads a whole server-sent event stream (it ends when the run ends) into its events. */
async function readStream(who: SignedIn, id: number): Promise<{ event: string; data: Record<string, unknown> }[]> {
  const res = await who.agent.get(`/api/runs/${id}/events`).set('Accept', 'text/event-stream').buffer(true)
    .parse((r, cb) => { let text = ''; r.on('data', (c: Buffer) => { text += c.toString(); }); r.on('end', () => cb(null, text)); }).expect(200);
  expect(res.headers['content-type']).toContain('text/event-stream');
  return (res.body as string).split('\n\n').filter((b) => b.startsWith('event:')).map((b) => {
    const [ev, data] = b.split('\n');
    return { event: ev!.slice('event: '.length), data: JSON.parse(data!.slice('data: '.length)) as Record<string, unknown> };
  });
}

describe('run queue', () => {
  let app: Express;
  let crabData: number;
  beforeAll(async () => {
    app = await testApp({ RUN_LIMIT_PER_USER: '2' });
    const crab = (await Stock.findOne({ where: { code: 'blue-lip-crab' } }))!;
    crabData = (await Dataset.findOne({ where: { stockId: crab.id, version: 1 } }))!.id;
  });

  it('refuses a run beyond the per-person limit with 429 naming the limit, even for simultaneous requests', async () => {
    const who = await signIn(app, await specPerson('assessor', 'limit-assessor'));
    const answers = await Promise.all([0, 1, 2].map(() => who.agent.post('/api/runs').set('x-csrf-token', who.csrf)
      .send({ datasetId: crabData, model: 'schaefer', bootstrap: 5000, priority: 'low' })));
    const statuses = answers.map((a) => a.status).sort();
    expect(statuses).toEqual([202, 202, 429]);
    const refused = answers.find((a) => a.status === 429)!;
    expect(refused.body.error.code).toBe('RUN_LIMIT');
    expect(refused.body.error.message).toContain('the limit is 2 per person');
    expect(refused.body.error.message).toContain('RUN_LIMIT_PER_USER');
    for (const a of answers.filter((x) => x.status === 202)) {
      await who.agent.post(`/api/runs/${a.body.run.id}/cancel`).set('x-csrf-token', who.csrf).expect(200);
    }
    const other = await signIn(app, await specPerson('assessor', 'limit-other'));
    await other.agent.post('/api/runs').set('x-csrf-token', other.csrf).send({ datasetId: crabData, model: 'schaefer', bootstrap: 0 }).expect(202);
  });

  it('streams progress from the worker and ends with the finished run, behind the role check', async () => {
    const who = await signIn(app, 'assessor');
    const start = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf)
      .send({ datasetId: crabData, model: 'schaefer', bootstrap: 400, seed: 5, priority: 'high' }).expect(202);
    const events = await readStream(who, start.body.run.id);
    expect(events[0]!.event).toBe('run');
    const progress = events.filter((e) => e.event === 'progress').map((e) => e.data.fraction as number);
    expect(progress.length).toBeGreaterThan(0);
    expect(progress.every((f) => f > 0 && f < 1)).toBeTrue();
    const last = events[events.length - 1]!;
    expect(last.event).toBe('run');
    expect((last.data.run as { status: string }).status).toBe('succeeded');
    const licensee = await signIn(app, 'licensee');
    const denied = await licensee.agent.get(`/api/runs/${start.body.run.id}/events`).set('Accept', 'text/event-stream').expect(403);
    expect(denied.body.error.code).toBe('FORBIDDEN');
    const plain = await who.agent.get(`/api/runs/${start.body.run.id}/events`).set('Accept', 'application/json').expect(406);
    expect(plain.body.error.code).toBe('EVENT_STREAM_ONLY');
  });

  it('cancels a running run for real: the worker stops, the row stays cancelled, a second cancel is refused', async () => {
    const who = await signIn(app, 'assessor');
    const start = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf)
      .send({ datasetId: crabData, model: 'schaefer', bootstrap: 5000, priority: 'high' }).expect(202);
    await waitForRun(who, start.body.run.id, (r) => r.status === 'running');
    await who.agent.post(`/api/runs/${start.body.run.id}/cancel`).set('x-csrf-token', who.csrf).expect(200);
    // the worker writes its duration once its computation has stopped
    const row = await (async () => {
      for (;;) {
        const r = (await Run.findByPk(start.body.run.id))!;
        if (r.durationMs !== null) return r;
        await new Promise((res) => setTimeout(res, 50));
      }
    })();
    expect(row.status).toBe('cancelled');
    expect(row.results).toBeNull();
    const again = await who.agent.post(`/api/runs/${start.body.run.id}/cancel`).set('x-csrf-token', who.csrf).expect(409);
    expect(again.body.error.code).toBe('RUN_FINISHED');
    const events = await readStream(who, start.body.run.id);
    expect((events[0]!.data.run as { status: string }).status).toBe('cancelled');
    expect(events.length).toBe(1);
    await waitForRun(who, start.body.run.id, finished);
  });

  it('orders the queue by class first, then by how many runs the owner already has waiting (fair share)', () => {
    // one person's twentieth normal run waits behind another's first; any high run goes before both
    expect(priorityFor('normal', 19)).toBeGreaterThan(priorityFor('normal', 0));
    expect(priorityFor('high', 500)).toBeLessThan(priorityFor('normal', 0));
    expect(priorityFor('normal', 99_999)).toBeLessThan(priorityFor('low', 0));
    expect(priorityFor('high', 0)).toBeGreaterThanOrEqual(1); // 0 would mean "no priority" to BullMQ
  });
});
