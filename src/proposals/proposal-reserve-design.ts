import { DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ReserveDesignFigures } from '../../api/proposals/proposal.schemas';
import { ChartFrame } from '../shared/charts/chart-frame';
import { ReserveMapChart, type ReserveMapData } from '../shared/charts/reserve-map-chart';
import { SigPipe } from '../shared/sig.pipe';

/** The reserve design a proposal carries: its map and the figures the board weighs with the quota. */
@Component({
  selector: 'bm-proposal-reserve-design',
  imports: [DecimalPipe, PercentPipe, SigPipe, ChartFrame, ReserveMapChart],
  template: `
    <bm-chart-frame [title]="'Reserve design: ' + d().name" [subtitle]="'From reserve study run #' + d().runId + '; equilibrium density with the reserve outlined'" fileName="proposal-reserve-map">
      <bm-reserve-map-chart [data]="map()" />
      <p class="bm-figs" data-testid="reserve-design-figures">
        Reserve {{ d().reserveArea | sig: 3 }} {{ d().areaUnit }} ({{ d().reserveShare | percent: '1.0-0' }} of the habitat) in {{ d().reserveCount }} part(s);
        fishing mortality outside {{ d().fishing | number: '1.2-2' }} /yr. Stock {{ d().total | sig }} {{ unit() }}, yield {{ d().yield | sig }} {{ unit() }}/yr,
        spillover {{ d().spillover | sig }} {{ unit() }}/yr. <strong>{{ d().persists ? 'The stock persists.' : 'The stock does not persist.' }}</strong>
        @if (d().criticalF !== null) { Lost at fishing mortality {{ d().criticalF | number: '1.2-2' }} /yr ({{ d().lossKind }}). }
        @if (d().recoveryYears !== null) { Recovers to 90% in about {{ d().recoveryYears | number: '1.0-0' }} years after a collapse with the fishery closed. }
      </p>
    </bm-chart-frame>
  `,
  styles: `.bm-figs { font-size: 13.5px; color: var(--bm-ink); margin: 8px 0 0; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProposalReserveDesign {
  readonly design = input.required<ReserveDesignFigures>();
  readonly unit = input('t');
  protected readonly d = this.design;
  protected readonly map = computed<ReserveMapData>(() => {
    const d = this.design();
    return { nx: d.nx, ny: d.ny, h: d.h, cells: d.cells, reserve: d.reserve, density: d.density, max: Math.max(d.params.K, ...d.density), unit: `${this.unit()}/${d.areaUnit}` };
  });
}
