import { DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { RunView, SurplusRunResults } from '../../api/runs/run.schemas';
import { BifurcationChart, type BifurcationData } from '../shared/charts/bifurcation-chart';
import { Caution } from '../shared/caution';
import { ChartFrame } from '../shared/charts/chart-frame';
import { SigPipe } from '../shared/sig.pipe';
import { EarlyWarningChart } from '../shared/charts/early-warning-chart';
import { FitChart, type FitChartData } from '../shared/charts/fit-chart';
import { ProjectionChart, type ProjectionChartData } from '../shared/charts/projection-chart';

/** Everything a single-stock run reports: key figures, estimates, diagnostics and the charts. */
@Component({
  selector: 'bm-surplus-results',
  imports: [Caution, DecimalPipe, PercentPipe, SigPipe, MatIconModule, ChartFrame, BifurcationChart, FitChart, ProjectionChart, EarlyWarningChart],
  templateUrl: './surplus-results.html',
  styleUrl: './surplus-results.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SurplusResults {
  readonly run = input.required<RunView>();
  readonly results = input.required<SurplusRunResults>();
  readonly unit = input('t');
  protected readonly fit = computed(() => this.results().fit);
  protected readonly quota = computed(() => this.results().quota);
  protected readonly bifurcation = computed<BifurcationData>(() => {
    const r = this.results();
    return {
      table: r.fold.table, hStar: r.fold.hStar, bFold: r.fold.bFold, unit: this.unit(),
      band: r.bootstrap ? { p5: r.bootstrap.hStar.p5, p95: r.bootstrap.hStar.p95 } : null,
      catches: r.fit.years.map((year, i) => ({ year, catch: r.fit.catches[i]! })),
      quota: r.quota?.proposal.proposed ?? null,
    };
  });
  protected readonly fitData = computed<FitChartData>(() => {
    const f = this.fit();
    const ix = f.indices[0]!;
    return { years: f.years, name: ix.name, observed: ix.residuals.map((res, t) => (res === null ? null : ix.fitted[t]! * Math.exp(res))), fitted: ix.fitted, residuals: ix.residuals };
  });
  protected readonly projection = computed<ProjectionChartData | null>(() => {
    const q = this.quota();
    if (!q) return null;
    const f = this.fit();
    return {
      // runs stored before the one limit reference point projected against limitFraction
      startYear: f.years[f.years.length - 1]! + 1, unit: this.unit(), limit: (q.stateMargin ? this.run().options.limit : this.run().options.limitFraction) * f.reference.bMsy,
      candidates: q.candidates, highlight: q.candidates.reduce((best, c) => (Math.abs(c.catchLevel - q.proposal.proposed) < Math.abs(best - q.proposal.proposed) ? c.catchLevel : best), q.candidates[0]?.catchLevel ?? 0),
    };
  });
  protected readonly control = computed(() => this.run().options.control ?? 'catch');
  /** Each control's bifurcations in words; runs stored before the full analysis list the catch fold only. */
  protected readonly sides = computed(() => {
    const fold = this.results().fold;
    const analyses = fold.catch ? [fold.catch, ...(fold.F ? [fold.F] : [])] : [];
    if (!analyses.length) return [{ control: 'catch' as const, hasFold: true, list: [{ kind: 'fold', at: fold.hStar, biomass: fold.bFold }], hysteresis: false, collapse: '', recovery: '', note: '' }];
    return analyses.map((a) => {
      const fmt = (v: number) => (a.control === 'F' ? `F = ${v.toFixed(3)}` : `${Math.round(v).toLocaleString('en-GB')} ${this.unit()}/yr`);
      return {
        control: a.control, hasFold: a.bifurcations.some((b) => b.kind === 'fold'), list: a.bifurcations, hysteresis: a.hysteresis,
        collapse: a.collapse ? fmt(a.collapse.at) : '', recovery: a.recovery ? fmt(a.recovery.at) : '', note: a.recoveryNote,
      };
    });
  });
  protected levelText(v: number): string {
    return this.control() === 'F' ? `F = ${v.toFixed(3)}` : `${Math.round(v).toLocaleString('en-GB')} ${this.unit()}`;
  }
  protected interval(name: string): [number, number] | null {
    const key: Record<string, string> = { r: 'r', K: 'K', MSY: 'msy', 'h*': 'hStar', B_MSY: 'bMsy' };
    return this.results().bootstrap?.intervals[key[name] ?? ''] ?? null;
  }
}
