/**
 * The run queue as API processes see it (BullMQ on Redis): they only enqueue, cancel and listen.
 * Workers (`npm run worker`, api/runs/run-processor.ts) claim and compute. Nothing here keeps
 * state between requests, so any number of API processes can share one Redis.
 */
import { EventEmitter } from 'node:events';
import { Queue, QueueEvents } from 'bullmq';
import { Redis, type RedisOptions } from 'ioredis';
import type { Config } from '../config';

export interface RunJobData {
  runId: number;
  userId: number;
}

export interface RunProgress {
  fraction: number;
  stage: string;
}

/** What a run's listeners hear: progress from the worker, or that its job ended (done, failed, removed). */
export type RunSignal = { type: 'progress'; progress: RunProgress } | { type: 'ended' };

export type RunPriority = 'high' | 'normal' | 'low';

/** BullMQ priorities: lower runs first. The class comes first, then fairness within it (see priorityFor). */
const PRIORITY_BASE: Record<RunPriority, number> = { high: 1, normal: 100_001, low: 200_001 };

/**
 * Fair scheduling: a run's priority within its class is the number of runs its owner already has
 * waiting or running, so one person's twentieth run waits behind everyone else's first.
 */
export function priorityFor(priority: RunPriority, ownerOpenRuns: number): number {
  return PRIORITY_BASE[priority] + Math.min(ownerOpenRuns, 99_999);
}

export const jobIdOf = (runId: number) => `run-${runId}`;
export const runIdOf = (jobId: string | undefined) => Number(/^run-(\d+)$/.exec(jobId ?? '')?.[1] ?? NaN);
export const cancelChannel = (queueName: string) => `${queueName}:cancel`;

/** A Redis connection; `blocking` ones (workers, event readers) must retry forever, as BullMQ requires. */
export function redisConnection(url: string, blocking: boolean): Redis {
  const opts: RedisOptions = blocking
    ? { maxRetriesPerRequest: null, enableReadyCheck: true }
    : { maxRetriesPerRequest: 2, connectTimeout: 5_000 };
  const redis = new Redis(url, opts);
  // why: without a listener ioredis reports every reconnect attempt as an unhandled error
  redis.on('error', () => {});
  return redis;
}

export class RunJobs {
  private queueRef: Queue<RunJobData> | null = null;
  private queueConnection: Redis | null = null;
  private publisher: Redis | null = null;
  private events: QueueEvents | null = null;
  private readonly signals = new EventEmitter().setMaxListeners(0);

  constructor(private readonly config: Pick<Config, 'REDIS_URL' | 'RUN_QUEUE'>) {}

  private get queue(): Queue<RunJobData> {
    if (!this.queueRef) {
      this.queueConnection = redisConnection(this.config.REDIS_URL, false);
      this.queueRef = new Queue<RunJobData>(this.config.RUN_QUEUE, { connection: this.queueConnection });
    }
    return this.queueRef;
  }

  /** Adds the run's job. Retries on the worker side are for infrastructure errors only (a model error fails at once). */
  async enqueue(runId: number, userId: number, priority: number): Promise<void> {
    await this.queue.add('run', { runId, userId }, {
      jobId: jobIdOf(runId), priority, attempts: 3, backoff: { type: 'exponential', delay: 2_000 },
      removeOnComplete: { age: 7 * 86_400 }, removeOnFail: { age: 30 * 86_400 },
    });
  }

  /**
   * Stops a run's job: removed while it waits; while a worker computes it, every worker hears the
   * cancel and the one holding it terminates the computation.
   */
  async cancel(runId: number): Promise<void> {
    const job = await this.queue.getJob(jobIdOf(runId));
    if (job && ['waiting', 'prioritized', 'delayed', 'waiting-children'].includes(await job.getState())) {
      await job.remove().catch(() => undefined); // taken by a worker meanwhile: the message below reaches it
    }
    this.publisher ??= redisConnection(this.config.REDIS_URL, false);
    await this.publisher.publish(cancelChannel(this.config.RUN_QUEUE), String(runId));
  }

  /** What /api/health shows for the run queue: Redis reachable, jobs by state, workers connected. */
  async health(): Promise<{ status: 'up' | 'degraded' | 'down'; detail?: string; figures: Record<string, number> }> {
    const counts = await this.queue.getJobCounts('waiting', 'prioritized', 'active', 'delayed', 'failed');
    const workers = (await this.queue.getWorkers()).length;
    const figures = { waiting: (counts.waiting ?? 0) + (counts.prioritized ?? 0) + (counts.delayed ?? 0), running: counts.active ?? 0, failed: counts.failed ?? 0, workers };
    if (workers === 0) return { status: 'degraded', detail: 'No run worker is connected: runs wait until one starts (npm run worker).', figures };
    return { status: 'up', figures };
  }

  /** State of a run's job in the queue, or null when the queue holds no job for it. */
  async state(runId: number): Promise<string | null> {
    const job = await this.queue.getJob(jobIdOf(runId));
    return job ? job.getState() : null;
  }

  /** Listens to one run's progress and end; returns the function that stops listening. */
  async listen(runId: number, listener: (s: RunSignal) => void): Promise<() => void> {
    if (!this.events) {
      const events = new QueueEvents(this.config.RUN_QUEUE, { connection: redisConnection(this.config.REDIS_URL, true) });
      events.on('error', () => {});
      events.on('progress', ({ jobId, data }) => {
        const p = data as Partial<RunProgress>;
        if (typeof p?.fraction === 'number') this.signals.emit(jobId, { type: 'progress', progress: { fraction: p.fraction, stage: String(p.stage ?? '') } });
      });
      for (const ended of ['completed', 'failed', 'removed'] as const) {
        events.on(ended, ({ jobId }: { jobId: string }) => this.signals.emit(jobId, { type: 'ended' }));
      }
      this.events = events;
      await events.waitUntilReady();
    }
    const id = jobIdOf(runId);
    this.signals.on(id, listener);
    return () => this.signals.off(id, listener);
  }

  async close(): Promise<void> {
    await Promise.allSettled([this.events?.close(), this.queueRef?.close()]);
    await Promise.allSettled([this.queueConnection?.quit(), this.publisher?.quit()]);
    this.events = null;
    this.queueRef = null;
    this.queueConnection = null;
    this.publisher = null;
  }
}
