import { DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { DiscreteRunResults } from '../../api/runs/run.schemas';
import { Caution } from '../shared/caution';
import { CascadeChart, type CascadeChartData } from '../shared/charts/cascade-chart';
import { ChartFrame } from '../shared/charts/chart-frame';
import { SigPipe } from '../shared/sig.pipe';

/** A stock-recruitment run: fit, reference points, the cascade against harvest and productivity, and the proposed rate. */
@Component({
  selector: 'bm-discrete-results',
  imports: [Caution, DecimalPipe, PercentPipe, SigPipe, MatIconModule, ChartFrame, CascadeChart],
  template: `
    <bm-caution />
    @for (w of results().warnings; track $index) { <div class="bm-warn" role="alert" data-testid="regime-warning"><mat-icon>warning_amber</mat-icon>{{ w }}</div> }
    <div class="bm-kpis">
      <div><span>Proposed harvest rate</span><strong data-testid="proposed-rate">{{ r().proposal.rate | percent: '1.1-1' }}</strong>
        <small>@if (r().proposal.band; as b) { band {{ b[0] | percent: '1.1-1' }} – {{ b[1] | percent: '1.1-1' }} } long run: {{ regimeText() }}</small></div>
      <div><span>u_MSY</span><strong>{{ r().fit.reference.uMsy | percent: '1.1-1' }}</strong><small>exact (Lambert W) for Ricker</small></div>
      <div><span>MSY</span><strong>{{ r().fit.reference.msy | sig }} {{ unit() }}</strong><small>spawners at MSY {{ r().fit.reference.sMsy | sig }} {{ unit() }}</small></div>
      <div><span>Cycles</span><strong>{{ cycleText() }}</strong><small>collapse from {{ r().harvestCascade.collapseAt | percent: '1.1-1' }}</small></div>
    </div>
    <bm-chart-frame title="Long-run stock against the harvest rate" subtitle="States visited after the transient at each harvest rate (taken before spawning); dashed lines: period doublings" fileName="cascade-harvest">
      <bm-cascade-chart [data]="harvestChart()" />
    </bm-chart-frame>
    <div class="bm-two">
      <bm-chart-frame title="Long-run stock against productivity" [subtitle]="'At the proposed harvest rate; the fitted value is ' + (productivity() | sig)" fileName="cascade-productivity">
        <bm-cascade-chart [data]="productivityChart()" />
      </bm-chart-frame>
      <section class="bm-card">
        <h3>Fit ({{ r().pairs.spawners.length }} spawner/recruit pairs, lognormal error)</h3>
        <table class="bm-est"><tbody>
          @for (p of params(); track p[0]) { <tr><td>{{ p[0] }}</td><td>{{ p[1] | sig }}</td></tr> }
          <tr><td>σ (log scale)</td><td>{{ r().fit.sigma | number: '1.3-3' }}</td></tr>
          <tr><td>log-likelihood / AICc</td><td>{{ r().fit.logLik | number: '1.1-1' }} / {{ r().fit.aicc | number: '1.1-1' }}</td></tr>
        </tbody></table>
        <h3>Doublings against the harvest rate</h3>
        <table class="bm-est"><thead><tr><th>Period becomes</th><th>Harvest rate</th></tr></thead><tbody>
          @for (c of r().harvestCascade.doublings; track $index) { <tr><td>{{ r().harvestCascade.periods[$index] }}</td><td>{{ c | percent: '1.2-2' }}</td></tr> }
          @empty { <tr><td colspan="2">None: the stock settles at every harvest rate.</td></tr> }
        </tbody></table>
      </section>
    </div>
  `,
  styles: `:host { display: flex; flex-direction: column; gap: 16px; } .bm-two { display: grid; grid-template-columns: 1fr 1fr; gap: 16px; }
    .bm-card { background: #fff; border: 1px solid var(--bm-line); border-radius: 8px; padding: 12px 16px; } h3 { margin: 8px 0; font-size: 16px; color: var(--bm-ink); }
    .bm-est { width: 100%; border-collapse: collapse; font-size: 13.5px; } .bm-est th { text-align: left; color: var(--bm-muted); border-bottom: 1px solid var(--bm-line); padding: 4px 6px; }
    .bm-est td { padding: 4px 6px; border-bottom: 1px solid #f0f3f4; }
    .bm-warn { display: flex; gap: 8px; align-items: center; color: #8a5a00; font-size: 14px; background: #fff6e5; border-radius: 8px; padding: 8px 12px; }
    .bm-kpis { display: grid; grid-template-columns: repeat(auto-fit, minmax(180px, 1fr)); gap: 12px; }
    .bm-kpis > div { background: #fff; border: 1px solid var(--bm-line); border-radius: 8px; padding: 10px 14px; display: flex; flex-direction: column; }
    .bm-kpis span, .bm-kpis small { color: var(--bm-muted); font-size: 12.5px; } .bm-kpis strong { font-size: 22px; color: var(--bm-ink); }
    @media (max-width: 1100px) { .bm-two { grid-template-columns: 1fr; } }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DiscreteResults {
  readonly results = input.required<DiscreteRunResults>();
  readonly unit = input('t');
  protected readonly r = this.results;
  protected readonly params = computed(() => Object.entries(this.results().fit.params));
  protected readonly productivity = computed(() => { const p = this.results().fit.params; return p['r'] ?? p['R'] ?? null; });
  protected readonly regimeText = computed(() => {
    const p = this.results().proposal;
    return p.regime === 'stable' ? 'settles' : p.regime === 'cycle' ? `cycles${p.period ? ` (period ${p.period})` : ''}` : p.regime === 'chaos' ? 'chaotic' : 'collapses';
  });
  protected readonly cycleText = computed(() => {
    const c = this.results().harvestCascade;
    if (!c.doublings.length) return 'none';
    return c.cyclesWhere === 'below' ? `below ${(100 * c.doublings[0]!).toFixed(1)}%` : `above ${(100 * c.doublings[0]!).toFixed(1)}%`;
  });
  protected readonly harvestChart = computed<CascadeChartData>(() => {
    const r = this.results();
    return {
      columns: r.harvestCascade.columns, doublings: r.harvestCascade.doublings, chaosOnset: r.harvestCascade.chaosOnset,
      proposed: r.proposal.rate, band: r.proposal.band, xLabel: 'Harvest rate before spawning', yLabel: `Stock before harvest (${this.unit()})`, percent: true,
    };
  });
  protected readonly productivityChart = computed<CascadeChartData>(() => {
    const r = this.results();
    return {
      columns: r.productivityCascade.columns, doublings: r.productivityCascade.doublings, chaosOnset: r.productivityCascade.chaosOnset,
      proposed: null, band: null, xLabel: r.fit.model === 'ricker' ? 'Productivity r' : 'Recruits per spawner R₀', yLabel: `Stock (${this.unit()})`, percent: false,
    };
  });
}
