import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { RunApi, type RunDetail } from './run-api';

describe('RunApi.watch', () => {
  beforeEach(() => jasmine.clock().install());
  afterEach(() => jasmine.clock().uninstall());

  function setup() {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    return { api: TestBed.inject(RunApi), http: TestBed.inject(HttpTestingController) };
  }
  const body = (status: string, progress: number) => ({ run: { id: 5, status, progress }, results: null }) as unknown as RunDetail;

  it('polls the run until it finishes and ends with the finished run', () => {
    const { api, http } = setup();
    const seen: string[] = [];
    let completed = false;
    api.watch(5, 400).subscribe({ next: (d) => seen.push(`${d.run.status}:${d.run.progress}`), complete: () => (completed = true) });
    jasmine.clock().tick(1);
    http.expectOne('/api/runs/5').flush(body('running', 0.2));
    jasmine.clock().tick(400);
    http.expectOne('/api/runs/5').flush(body('running', 0.7));
    jasmine.clock().tick(400);
    http.expectOne('/api/runs/5').flush(body('succeeded', 1));
    jasmine.clock().tick(2000);
    http.verify();
    expect(seen).toEqual(['running:0.2', 'running:0.7', 'succeeded:1']);
    expect(completed).toBeTrue();
  });

  it('waits for a slow answer instead of starting a second request', () => {
    const { api, http } = setup();
    api.watch(5, 400).subscribe();
    jasmine.clock().tick(1);
    const first = http.expectOne('/api/runs/5');
    jasmine.clock().tick(1200);
    http.expectNone('/api/runs/5');
    first.flush(body('cancelled', 0.3));
    jasmine.clock().tick(2000);
    http.verify();
  });
});
