import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, exhaustMap, map, takeWhile, timer } from 'rxjs';
import type { RunResults, RunSummary, RunView, StartRunBody } from '../../api/runs/run.schemas';

export interface RunDetail {
  run: RunView;
  results: RunResults | null;
}

const FINAL = new Set(['succeeded', 'failed', 'cancelled']);

@Injectable({ providedIn: 'root' })
export class RunApi {
  private readonly http = inject(HttpClient);

  start(body: Partial<StartRunBody> & { datasetId: number; model: string }): Observable<RunView> {
    return this.http.post<{ run: RunView }>('/api/runs', body).pipe(map((r) => r.run));
  }

  get(id: number): Observable<RunDetail> {
    return this.http.get<RunDetail>(`/api/runs/${id}`);
  }

  /** The run as it progresses: polled until it finishes (the last value is the finished run). */
  watch(id: number, everyMs = 400): Observable<RunDetail> {
    return timer(0, everyMs).pipe(
      // exhaustMap: a slow answer is awaited, not cancelled by the next tick
      exhaustMap(() => this.get(id)),
      takeWhile((d) => !FINAL.has(d.run.status), true),
    );
  }

  cancel(id: number): Observable<RunView> {
    return this.http.post<{ run: RunView }>(`/api/runs/${id}/cancel`, {}).pipe(map((r) => r.run));
  }

  listForStock(stockId: number): Observable<RunSummary[]> {
    return this.http.get<{ runs: RunSummary[] }>(`/api/stocks/${stockId}/runs`).pipe(map((r) => r.runs));
  }
}
