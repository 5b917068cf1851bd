import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { RUN_EVENT_SOURCE, RunApi, type RunDetail, type RunEventSource } from './run-api';

class FakeSource implements RunEventSource {
  static last: FakeSource;
  readonly listeners = new Map<string, (e: MessageEvent<string>) => void>();
  onerror: ((e: Event) => void) | null = null;
  readyState = 1;
  closed = false;
  constructor(readonly url: string) { FakeSource.last = this; }
  addEventListener(type: string, l: (e: MessageEvent<string>) => void): void { this.listeners.set(type, l); }
  close(): void { this.closed = true; this.readyState = 2; }
  emit(type: string, data: unknown): void { this.listeners.get(type)!(new MessageEvent(type, { data: JSON.stringify(data) })); }
}

describe('RunApi.watch', () => {
  function setup() {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: RUN_EVENT_SOURCE, useValue: (url: string) => new FakeSource(url) }],
    });
    return { api: TestBed.inject(RunApi), http: TestBed.inject(HttpTestingController) };
  }
  const run = (status: string, progress: number) => ({ id: 5, status, progress, stage: null });
  const body = (status: string, progress: number) => ({ run: run(status, progress), results: { kind: 'surplus' } }) as unknown as RunDetail;

  it('follows the run through its event stream and ends with the finished run and its results', () => {
    const { api, http } = setup();
    const seen: string[] = [];
    let completed = false;
    api.watch(5).subscribe({ next: (d) => seen.push(`${d.run.status}:${d.run.progress}:${d.results ? 'results' : '-'}`), complete: () => (completed = true) });
    const source = FakeSource.last;
    expect(source.url).toBe('/api/runs/5/events');
    source.emit('run', { type: 'run', run: run('queued', 0) });
    source.emit('progress', { type: 'progress', fraction: 0.2, stage: 'Bootstrap 100 of 500' });
    source.emit('progress', { type: 'progress', fraction: 0.7, stage: 'Bootstrap 400 of 500' });
    http.expectNone('/api/runs/5');
    source.emit('run', { type: 'run', run: run('succeeded', 1) });
    expect(source.closed).toBeTrue();
    http.expectOne('/api/runs/5').flush(body('succeeded', 1));
    http.verify();
    expect(seen).toEqual(['queued:0:-', 'running:0.2:-', 'running:0.7:-', 'succeeded:1:results']);
    expect(completed).toBeTrue();
  });

  it('reports why a refused stream was refused, through the HTTP answer', () => {
    const { api, http } = setup();
    let error: unknown = null;
    api.watch(5).subscribe({ error: (e: unknown) => (error = e) });
    const source = FakeSource.last;
    source.readyState = 2;
    source.onerror!(new Event('error'));
    http.expectOne('/api/runs/5').flush({ error: { code: 'FORBIDDEN', message: 'no' } }, { status: 403, statusText: 'Forbidden' });
    expect(error).not.toBeNull();
  });

  it('closes the stream when the page stops watching', () => {
    const { api } = setup();
    const sub = api.watch(5).subscribe();
    sub.unsubscribe();
    expect(FakeSource.last.closed).toBeTrue();
  });
});
