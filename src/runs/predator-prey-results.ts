import { DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { PredatorPreyRunResults } from '../../api/runs/run.schemas';
import { Caution } from '../shared/caution';
import { ChartFrame } from '../shared/charts/chart-frame';
import { SigPipe } from '../shared/sig.pipe';
import { PALETTE } from '../shared/charts/chart-kit';
import { PhasePlaneChart, type PhasePlaneData } from '../shared/charts/phase-plane-chart';
import { SeriesChart, type SeriesLine } from '../shared/charts/series-chart';
import { FitChart, type FitChartData } from '../shared/charts/fit-chart';
import { CatchPlaneChart, type CatchPlaneData } from '../shared/charts/catch-plane-chart';

/** A linked-stock run: estimates, the equilibrium and its eigenvalues, bifurcations in each catch, phase plane and series. */
@Component({
  selector: 'bm-predator-prey-results',
  imports: [Caution, DecimalPipe, PercentPipe, SigPipe, MatIconModule, ChartFrame, PhasePlaneChart, SeriesChart, FitChart, CatchPlaneChart],
  template: `
    <bm-caution />
    @for (w of results().fit.convergence.warnings; track $index) { <div class="bm-warn"><mat-icon>warning_amber</mat-icon>{{ w }}</div> }
    <div class="bm-two">
      <bm-chart-frame title="Phase plane" subtitle="Fitted trajectory with both nullclines and the equilibrium" fileName="phase-plane">
        <bm-phase-plane-chart [data]="phase()" />
      </bm-chart-frame>
      <bm-chart-frame title="Both populations" subtitle="Fitted biomass of prey and predator" fileName="predator-prey-series">
        <bm-series-chart [years]="years()" [lines]="lines()" [yLabel]="'Biomass (' + unit() + ')'" />
      </bm-chart-frame>
    </div>
    <div class="bm-two">
      @for (f of fits(); track f.name) {
        <bm-chart-frame [title]="f.title" subtitle="Observed index (points), fitted q·B (line) and log residuals" [fileName]="'fit-' + f.name">
          <bm-fit-chart [data]="f" />
        </bm-chart-frame>
      }
    </div>
    <div class="bm-two">
      <section class="bm-card" data-testid="linked-estimates">
        <h3>Estimates</h3>
        <div class="bm-scroll"><table class="bm-est"><thead><tr><th></th><th>Estimate</th><th>95% (Hessian)</th><th>95% (bootstrap)</th></tr></thead><tbody>
          @for (e of results().fit.estimates; track e.name) {
            <tr><td>{{ e.name }}</td><td>{{ e.value | sig }}</td><td>@if (e.ci95; as c) { {{ c[0] | sig }} – {{ c[1] | sig }} } @else { — }</td>
              <td>@if (boot(e.name); as b) { {{ b[0] | sig }} – {{ b[1] | sig }} } @else { — }</td></tr>
          }
        </tbody></table></div>
        <p class="bm-small">Log-likelihood {{ results().fit.logLik | number: '1.2-2' }}, AIC {{ results().fit.aic | number: '1.2-2' }}, AICc {{ results().fit.aicc | number: '1.2-2' }}
          ({{ results().fit.nParams }} parameters, {{ results().fit.nObs }} survey observations).
          @if (results().bootstrap; as b) { Bootstrap: {{ b.replicates }} replicates. }</p>
        @if (results().fit.equilibrium; as eq) {
          <p>Equilibrium without harvest: prey {{ eq.prey | number: '1.0-0' }}, predator {{ eq.predator | number: '1.0-0' }} {{ unit() }},
            <strong>{{ eq.stable ? 'stable' : 'unstable' }}</strong>; eigenvalues {{ eq.eigen.re[0] | number: '1.3-3' }} ± {{ eq.eigen.im[0] | number: '1.3-3' }}i.</p>
        }
      </section>
      <section class="bm-card" data-testid="fixed-quantities">
        <h3>Fixed quantities</h3>
        <div class="bm-scroll"><table class="bm-est"><thead><tr><th></th><th>Value</th><th>Why it is fixed</th></tr></thead><tbody>
          @for (q of results().fit.fixed ?? []; track q.name) { <tr><td>{{ q.name }}</td><td>{{ q.value | sig }}</td><td>{{ q.reason }}</td></tr> }
          @empty { <tr><td colspan="3">Nothing is fixed: conversion efficiency and handling time were estimated.</td></tr> }
        </tbody></table></div>
        @if (results().comparison; as cmp) {
          <h3>Model comparison</h3>
          <table class="bm-est" data-testid="model-comparison"><thead><tr><th>Model</th><th>lnL</th><th>k</th><th>AIC</th><th>AICc</th><th>ΔAICc</th></tr></thead><tbody>
            @for (c of cmp; track c.model) {
              <tr><td>{{ c.model === 'lotka-volterra' ? 'Lotka-Volterra' : 'Rosenzweig-MacArthur' }}</td><td>{{ c.logLik | number: '1.2-2' }}</td><td>{{ c.nParams }}</td>
                <td>{{ c.aic | number: '1.2-2' }}</td><td>{{ c.aicc | number: '1.2-2' }}</td><td>{{ c.deltaAicc | number: '1.2-2' }}</td></tr>
            }
          </tbody></table>
        }
      </section>
    </div>
    @if (plane(); as cp) {
      <div class="bm-two">
        <bm-chart-frame title="Catch plane" subtitle="Where the equilibrium folds, cycles or loses the predator as both catches change" fileName="catch-plane">
          <bm-catch-plane-chart [data]="cp" />
        </bm-chart-frame>
        @if (results().current; as c) {
          <section class="bm-card" data-testid="pair-margins">
            <h3>Last year's catches in the catch plane</h3>
            <p>Prey {{ c.preyCatch | number: '1.0-0' }} and predator {{ c.predatorCatch | number: '1.0-0' }} {{ unit() }}/yr.</p>
            <table class="bm-est"><tbody>
              <tr><td>Raising the prey catch alone</td><td>{{ axisText(c.margins.preyAxis) }}</td></tr>
              <tr><td>Raising the predator catch alone</td><td>{{ axisText(c.margins.predatorAxis) }}</td></tr>
              <tr><td>Probability the pair lies beyond a curve</td><td>{{ c.pCross | percent: '1.1-1' }}</td></tr>
              <tr><td>Prey below {{ c.projection.limitFraction | percent }} of its equilibrium within {{ c.projection.years }} years</td><td>{{ c.projection.pPreyBelowLimit | percent: '1.1-1' }}</td></tr>
              <tr><td>Predator below {{ c.projection.limitFraction | percent }} of its equilibrium within {{ c.projection.years }} years</td><td>{{ c.projection.pPredatorBelowLimit | percent: '1.1-1' }}</td></tr>
            </tbody></table>
          </section>
        }
      </div>
    }
    <div class="bm-two">
      <section class="bm-card" data-testid="bifurcation-events">
        <h3>Bifurcations as catch rises</h3>
        <div class="bm-scroll"><table class="bm-est"><thead><tr><th>Catch of</th><th>Kind</th><th>At catch ({{ unit() }}/yr)</th><th>Prey</th><th>Predator</th></tr></thead><tbody>
          @for (e of events(); track $index) {
            <tr><td>{{ e.of }}</td><td>{{ e.label }}</td><td>{{ e.h | number: '1.0-0' }}</td><td>{{ e.x[0] | number: '1.0-0' }}</td><td>{{ e.x[1] | number: '1.0-0' }}</td></tr>
          } @empty { <tr><td colspan="5">No bifurcation up to four times the largest historical catch.</td></tr> }
        </tbody></table></div>
        <p class="bm-small">Fold: stable and unstable equilibria meet and vanish. Hopf: the equilibrium turns into a limit cycle. Boundary: a species reaches zero (transcritical with the extinction equilibrium).</p>
      </section>
    </div>
  `,
  styles: `:host { display: flex; flex-direction: column; gap: 16px; } .bm-two { display: grid; grid-template-columns: 1fr 1fr; gap: 16px; }
    .bm-card { background: #fff; border: 1px solid var(--bm-line); border-radius: 8px; padding: 12px 16px; } h3 { margin: 0 0 8px; font-size: 16px; color: var(--bm-ink); }
    .bm-est { width: 100%; border-collapse: collapse; font-size: 13.5px; } .bm-est th { text-align: left; color: var(--bm-muted); border-bottom: 1px solid var(--bm-line); padding: 4px 6px; }
    .bm-est td { padding: 4px 6px; border-bottom: 1px solid #f0f3f4; } .bm-small { color: var(--bm-muted); font-size: 12.5px; }
    .bm-warn { display: flex; gap: 8px; align-items: center; margin: 0; color: var(--bm-muted); font-size: 13px; } .bm-warn { color: #8a5a00; }
    @media (max-width: 1100px) { .bm-two { grid-template-columns: 1fr; } }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PredatorPreyResults {
  readonly results = input.required<PredatorPreyRunResults>();
  readonly unit = input('t');
  protected readonly years = computed(() => this.results().years);
  protected readonly phase = computed<PhasePlaneData>(() => {
    const r = this.results();
    return { prey: r.fit.prey, predator: r.fit.predator, years: r.years, preyNullcline: r.preyNullcline, predatorNullcline: r.predatorNullcline, equilibrium: r.fit.equilibrium, unit: this.unit() };
  });
  protected readonly lines = computed<SeriesLine[]>(() => [
    { label: 'Prey', colour: PALETTE.prey, values: this.results().fit.prey },
    { label: 'Predator', colour: PALETTE.predator, values: this.results().fit.predator },
  ]);
  protected readonly fits = computed<(FitChartData & { title: string })[]>(() => {
    const r = this.results();
    return r.fit.indices.filter((ix) => ix.observed && ix.fitted).map((ix) => ({
      title: `${ix.species === 'prey' ? 'Prey' : 'Predator'} survey: ${ix.name}`, years: r.years, name: ix.name, observed: ix.observed, fitted: ix.fitted, residuals: ix.residuals,
    }));
  });
  protected readonly plane = computed<CatchPlaneData | null>(() => {
    const r = this.results();
    if (!r.catchPlane) return null;
    const last = r.years.length - 1;
    return {
      unit: this.unit(), preyMax: r.catchPlane.preyMax, predatorMax: r.catchPlane.predatorMax, curves: r.catchPlane.curves,
      cloud: r.current?.cloud ?? [], current: { preyCatch: r.preyCatch[last]!, predatorCatch: r.predatorCatch[last]! }, proposed: null,
    };
  });
  protected boot(name: string): [number, number] | null {
    const lv = this.results().fit.model === 'lotka-volterra';
    const keys: Record<string, string> = lv ? { r: 'a', attack: 'b', mortality: 'c' } : { attack: 'a', mortality: 'm', handling: 'h', conversion: 'e' };
    const key = keys[name] ?? name;
    return this.results().bootstrap?.intervals[key] ?? null;
  }
  protected axisText(m: { kind: string; at: number | null; margin: number | null }): string {
    if (m.margin === null || m.at === null) return 'no curve met within the mapped range';
    const kind = m.kind === 'transcritical' ? 'predator loss' : m.kind;
    return `${Math.round(m.margin).toLocaleString('en-GB')} ${this.unit()} to the ${kind} at ${Math.round(m.at).toLocaleString('en-GB')}`;
  }
  protected readonly events = computed(() => {
    const label = { fold: 'Fold', hopf: 'Hopf', boundary: 'Boundary' } as const;
    const b = this.results().bifurcations;
    return [
      ...b.preyCatch.events.map((e) => ({ ...e, of: 'prey', label: label[e.kind] })),
      ...b.predatorCatch.events.map((e) => ({ ...e, of: 'predator', label: label[e.kind] })),
    ];
  });
}
