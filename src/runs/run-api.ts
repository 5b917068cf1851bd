import { HttpClient } from '@angular/common/http';
import { Injectable, InjectionToken, inject } from '@angular/core';
import { Observable, Subscription, map } from 'rxjs';
import type { RunResults, RunStreamEvent, RunSummary, RunView, StartRunBody } from '../../api/runs/run.schemas';

export interface RunDetail {
  run: RunView;
  results: RunResults | null;
}

/** The browser's EventSource (a spec provides a fake). Same origin: the session cookie goes with it. */
export interface RunEventSource {
  addEventListener(type: string, listener: (e: MessageEvent<string>) => void): void;
  onerror: ((e: Event) => void) | null;
  readonly readyState: number;
  close(): void;
}

export const RUN_EVENT_SOURCE = new InjectionToken<(url: string) => RunEventSource>('RUN_EVENT_SOURCE', {
  providedIn: 'root',
  factory: () => (url: string) => new EventSource(url),
});

const FINAL = new Set(['succeeded', 'failed', 'cancelled']);
/** EventSource.CLOSED: the server refused the stream (signed out, no right, no such run). */
const CLOSED = 2;

@Injectable({ providedIn: 'root' })
export class RunApi {
  private readonly http = inject(HttpClient);
  private readonly eventSource = inject(RUN_EVENT_SOURCE);

  start(body: Partial<StartRunBody> & { datasetId: number; model: string }): Observable<RunView> {
    return this.http.post<{ run: RunView }>('/api/runs', body).pipe(map((r) => r.run));
  }

  get(id: number): Observable<RunDetail> {
    return this.http.get<RunDetail>(`/api/runs/${id}`);
  }

  /**
   * The run as it progresses, from the server's event stream (progress comes from the run's worker,
   * not from polling); the last value is the finished run with its results.
   */
  watch(id: number): Observable<RunDetail> {
    return new Observable<RunDetail>((sub) => {
      const source = this.eventSource(`/api/runs/${id}/events`);
      let last: RunView | null = null;
      let final: Subscription | null = null;
      const finish = () => {
        source.close();
        // the finished run's results, and a refused stream's reason, come through the HTTP client
        final ??= this.get(id).subscribe({ next: (d) => { sub.next(d); sub.complete(); }, error: (e: unknown) => sub.error(e) });
      };
      source.addEventListener('run', (e) => {
        const ev = JSON.parse(e.data) as Extract<RunStreamEvent, { type: 'run' }>;
        last = ev.run;
        if (FINAL.has(ev.run.status)) finish();
        else sub.next({ run: ev.run, results: null });
      });
      source.addEventListener('progress', (e) => {
        const ev = JSON.parse(e.data) as Extract<RunStreamEvent, { type: 'progress' }>;
        if (last) sub.next({ run: { ...last, status: 'running', progress: ev.fraction, stage: ev.stage }, results: null });
      });
      // a dropped connection is retried by the browser; a refused one is final
      source.onerror = () => { if (source.readyState === CLOSED) finish(); };
      return () => { source.close(); final?.unsubscribe(); };
    });
  }

  cancel(id: number): Observable<RunView> {
    return this.http.post<{ run: RunView }>(`/api/runs/${id}/cancel`, {}).pipe(map((r) => r.run));
  }

  listForStock(stockId: number): Observable<RunSummary[]> {
    return this.http.get<{ runs: RunSummary[] }>(`/api/stocks/${stockId}/runs`).pipe(map((r) => r.runs));
  }
}
