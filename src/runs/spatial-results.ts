import { DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { SpatialRunResults } from '../../api/runs/run.schemas';
import { Caution } from '../shared/caution';
import { ChartFrame } from '../shared/charts/chart-frame';
import { PALETTE } from '../shared/charts/chart-kit';
import { ReserveMapChart, type ReserveMapData } from '../shared/charts/reserve-map-chart';
import { XyChart, type XyLine } from '../shared/charts/xy-chart';
import { SigPipe } from '../shared/sig.pipe';

const DESIGN_COLOURS = [PALETTE.ink, PALETTE.brink, PALETTE.predator, PALETTE.sea, PALETTE.danger, PALETTE.muted];

/** A reserve study: designs side by side (maps, figures), yield and stock as fishing rises, and the recovery front. */
@Component({
  selector: 'bm-spatial-results',
  imports: [Caution, DecimalPipe, PercentPipe, SigPipe, MatIconModule, ChartFrame, ReserveMapChart, XyChart],
  template: `
    <bm-caution />
    <section class="bm-card" data-testid="design-comparison">
      <h3>Designs compared at fishing mortality {{ r().fishing | number: '1.2-2' }} /yr outside reserves</h3>
      <div class="bm-scroll"><table class="bm-est">
        <thead><tr><th>Design</th><th>Reserve ({{ r().areaUnit }})</th><th>Share</th><th>Reserves</th><th>Spacing (km)</th><th>Stock</th><th>Yield /yr</th><th>Spillover /yr</th><th>Persists</th><th>Stock lost at F</th><th>Recovery (yr)</th></tr></thead>
        <tbody>
          @for (d of r().designs; track $index) {
            <tr><td>{{ d.name }}</td><td>{{ d.reserveArea | sig: 3 }}</td><td>{{ d.reserveShare | percent: '1.0-0' }}</td><td>{{ d.reserveCount }}</td>
              <td>{{ d.spacing === null ? '—' : (d.spacing | sig: 3) }}</td><td>{{ d.total | sig }} {{ unit() }}</td><td>{{ d.yield | sig }} {{ unit() }}</td><td>{{ d.spillover | sig }} {{ unit() }}</td>
              <td [class.bm-bad]="!d.persists">{{ d.persists ? 'yes' : 'no' }}</td>
              <td>@if (d.sweep.criticalF !== null) { {{ d.sweep.criticalF | number: '1.2-2' }} ({{ d.sweep.kind }}) } @else { beyond {{ sweepTop(d) | number: '1.1-1' }} }</td>
              <td>{{ d.recoveryYears === null ? '—' : (d.recoveryYears | number: '1.0-0') }}</td></tr>
          }
        </tbody>
      </table></div>
    </section>
    <div class="bm-maps">
      @for (m of maps(); track $index) {
        <bm-chart-frame [title]="m.name" [subtitle]="m.subtitle" [fileName]="'reserve-map-' + ($index + 1)">
          <bm-reserve-map-chart [data]="m.data" />
        </bm-chart-frame>
      }
    </div>
    <div class="bm-two">
      <bm-chart-frame title="Yield as fishing rises" subtitle="Equilibrium catch per year from the fished area; the stock is lost where each line ends" fileName="reserve-yield-sweep">
        <bm-xy-chart [lines]="yieldLines()" xLabel="Fishing mortality outside reserves (/yr)" [yLabel]="'Yield (' + unit() + '/yr)'" />
      </bm-chart-frame>
      @if (frontLines().length) {
        <bm-chart-frame title="Recovery front" [subtitle]="frontSubtitle()" fileName="recovery-front">
          <bm-xy-chart [lines]="frontLines()" xLabel="Years after collapse (fishery closed)" yLabel="Front distance from reserve (km)" />
        </bm-chart-frame>
      }
    </div>
  `,
  styles: `:host { display: flex; flex-direction: column; gap: 16px; } .bm-two, .bm-maps { display: grid; grid-template-columns: 1fr 1fr; gap: 16px; }
    .bm-card { background: #fff; border: 1px solid var(--bm-line); border-radius: 8px; padding: 12px 16px; } h3 { margin: 0 0 8px; font-size: 16px; color: var(--bm-ink); }
    .bm-scroll { overflow-x: auto; } .bm-est { width: 100%; border-collapse: collapse; font-size: 13.5px; white-space: nowrap; }
    .bm-est th { text-align: left; color: var(--bm-muted); border-bottom: 1px solid var(--bm-line); padding: 4px 6px; } .bm-est td { padding: 4px 6px; border-bottom: 1px solid #f0f3f4; }
    .bm-bad { color: var(--bm-danger); font-weight: 600; }
    @media (max-width: 1100px) { .bm-two, .bm-maps { grid-template-columns: 1fr; } }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpatialResults {
  readonly results = input.required<SpatialRunResults>();
  readonly unit = input('t');
  protected readonly r = this.results;
  private readonly densityUnit = computed(() => `${this.unit()}/${this.results().areaUnit}`);
  protected sweepTop(d: SpatialRunResults['designs'][number]): number {
    return d.sweep.points[d.sweep.points.length - 1]?.F ?? 0;
  }
  protected readonly maps = computed(() => {
    const r = this.results();
    const max = Math.max(r.params.K, ...r.designs.flatMap((d) => d.density));
    return r.designs.map((d) => ({
      name: d.name,
      subtitle: `Equilibrium density; ${d.persists ? 'the stock persists' : 'the stock does not persist'}; reserve outlined`,
      data: { nx: d.nx, ny: d.ny, h: d.h, cells: d.cells, reserve: d.reserve, density: d.density, max, unit: this.densityUnit() } satisfies ReserveMapData,
    }));
  });
  protected readonly yieldLines = computed<XyLine[]>(() => this.results().designs.map((d, i) => ({
    label: d.name, colour: DESIGN_COLOURS[i % DESIGN_COLOURS.length]!, dash: i % 2 ? '6 3' : undefined,
    points: d.sweep.points.filter((p) => p.F === 0 || p.total > 1e-6 * (d.sweep.points[0]?.total ?? 0)).map((p) => [p.F, p.yield] as [number, number]),
  })));
  protected readonly frontLines = computed<XyLine[]>(() => this.results().designs.filter((d) => d.front && d.front.track.length).map((d, i) => ({
    label: d.name, colour: DESIGN_COLOURS[i % DESIGN_COLOURS.length]!, dash: i % 2 ? '6 3' : undefined,
    points: d.front!.track.map((p) => [p.t, p.x] as [number, number]),
  })));
  protected readonly frontSubtitle = computed(() => {
    const d = this.results().designs.find((x) => x.front?.speed);
    const th = d?.front?.theory;
    return d ? `Measured speed ${d.front!.speed!.toFixed(2)} km/yr (${d.name})${th ? `; fronts approach 2√(rD) = ${th.toFixed(2)} km/yr on long coasts` : ''}` : 'Front position where density passes half its carrying capacity';
  });
}
