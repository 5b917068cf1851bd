import { DatePipe, DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { catchError, firstValueFrom, of, switchMap } from 'rxjs';
import type { DiscreteRunResults, PredatorPreyRunResults, SpatialRunResults, SurplusRunResults } from '../../api/runs/run.schemas';
import { AuthStore } from '../core/auth/auth-store';
import { Notifier } from '../core/errors/notifier';
import { ModelNamePipe } from '../shared/sig.pipe';
import { StockApi } from '../stocks/stock-api';
import { DiscreteResults } from './discrete-results';
import { PredatorPreyResults } from './predator-prey-results';
import { SpatialResults } from './spatial-results';
import { RunApi, type RunDetail } from './run-api';
import { SurplusResults } from './surplus-results';

@Component({
  selector: 'bm-run-page',
  imports: [RouterLink, ModelNamePipe, DatePipe, DecimalPipe, PercentPipe, MatProgressBarModule, MatButtonModule, MatIconModule, SurplusResults, PredatorPreyResults, DiscreteResults, SpatialResults],
  templateUrl: './run-page.html',
  styles: `.bm-head { display: flex; align-items: flex-end; gap: 8px 16px; flex-wrap: wrap; } .bm-grow { flex: 1; }
    .bm-head > div { min-width: 0; } .bm-head button { white-space: normal; height: auto; min-height: 40px; max-width: 100%; }
    .bm-progress { background: #fff; border: 1px solid var(--bm-line); border-radius: 8px; padding: 16px; margin: 12px 0; }
    .bm-failed { background: #fdecea; border-radius: 8px; padding: 12px 16px; color: var(--bm-danger); display: flex; gap: 8px; align-items: center; }
    .bm-back { display: inline-flex; align-items: center; gap: 4px; text-decoration: none; font-size: 14px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunPage {
  readonly id = input.required<string>();
  private readonly api = inject(RunApi);
  private readonly router = inject(Router);
  private readonly notifier = inject(Notifier);
  protected readonly auth = inject(AuthStore);
  private readonly stocks = inject(StockApi);
  protected readonly cancelling = signal(false);
  protected readonly detail = toSignal<RunDetail | null>(
    toObservable(computed(() => Number(this.id()))).pipe(switchMap((id) => this.api.watch(id)), catchError((err: Error) => {
      this.notifier.error(err.message);
      return of(null);
    })),
  );
  protected readonly stock = toSignal(toObservable(computed(() => this.detail()?.run.stockId ?? null)).pipe(
    switchMap((sid) => (sid ? this.stocks.get(sid) : of(null))),
  ));
  protected readonly surplus = computed(() => { const r = this.detail()?.results; return r?.kind === 'surplus' ? (r as SurplusRunResults) : null; });
  protected readonly linked = computed(() => { const r = this.detail()?.results; return r?.kind === 'predator-prey' ? (r as PredatorPreyRunResults) : null; });
  protected readonly discrete = computed(() => { const r = this.detail()?.results; return r?.kind === 'discrete' ? (r as DiscreteRunResults) : null; });
  protected readonly spatial = computed(() => { const r = this.detail()?.results; return r?.kind === 'spatial' ? (r as SpatialRunResults) : null; });

  protected async cancel(): Promise<void> {
    this.cancelling.set(true);
    try {
      await firstValueFrom(this.api.cancel(Number(this.id())));
      this.notifier.info('The run was cancelled.');
    } catch (err) {
      this.notifier.error(err instanceof Error ? err.message : 'Could not cancel the run.');
    } finally {
      this.cancelling.set(false);
    }
  }

  protected propose(): void {
    void this.router.navigate(['/proposals/new'], { queryParams: { run: this.id() } });
  }
}
