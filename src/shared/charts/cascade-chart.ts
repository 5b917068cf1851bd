import { ChangeDetectionStrategy, Component, ElementRef, effect, input, viewChild } from '@angular/core';
import { scaleLinear } from 'd3';
import { PALETTE, axes, frame, legend } from './chart-kit';
import { containerWidth, heightFor } from './container-width';

export interface CascadeChartData {
  columns: { c: number; states: number[]; regime: string }[];
  doublings: number[];
  chaosOnset: number | null;
  /** Proposed harvest rate and its bootstrap band (harvest-rate diagrams only). */
  proposed: number | null;
  band: [number, number] | null;
  xLabel: string;
  yLabel: string;
  /** Format of control values on the axis (percent for harvest rates). */
  percent: boolean;
}

/** Orbit diagram: the long-run states at each control value, the doublings, the onset of chaos and the proposed rate. */
@Component({
  selector: 'bm-cascade-chart',
  styles: `:host { display: block; }`,
  template: `<svg #svg data-chart="cascade" role="img" aria-label="Long-run states against the control"></svg>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CascadeChart {
  readonly data = input.required<CascadeChartData>();
  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly drawWidth = containerWidth(() => 720);

  constructor() {
    effect(() => this.draw(this.data(), this.drawWidth()));
  }

  private draw(d: CascadeChartData, width: number): void {
    const svg = this.svg().nativeElement;
    const f = frame(svg, width, heightFor(width, 440));
    const cs = d.columns.map((c) => c.c);
    const x = scaleLinear().domain([Math.min(...cs), Math.max(...cs)]).range([0, f.width]);
    const top = Math.max(1e-9, ...d.columns.flatMap((c) => c.states));
    const y = scaleLinear().domain([0, top * 1.05]).range([f.height, 0]);
    svg.setAttribute('data-x-domain', x.domain().join(','));
    svg.setAttribute('data-x-range', x.range().join(','));
    const pct = (v: number) => `${Math.round(v * 100)}%`;
    if (d.band) {
      f.g.append('rect').attr('class', 'band').attr('x', x(d.band[0])).attr('width', Math.max(1, x(d.band[1]) - x(d.band[0])))
        .attr('y', 0).attr('height', f.height).attr('fill', PALETTE.band).attr('opacity', 0.45);
    }
    axes(f, x, y, d.xLabel, d.yLabel, d.percent ? pct : undefined);
    const pts = d.columns.flatMap((c) => c.states.map((s) => [c.c, s, c.regime] as const));
    f.g.append('g').attr('class', 'states').selectAll('circle').data(pts).join('circle')
      .attr('cx', (p) => x(p[0])).attr('cy', (p) => y(p[1])).attr('r', 1.1)
      .attr('fill', (p) => (p[2] === 'chaos' ? PALETTE.danger : p[2] === 'cycle' ? PALETTE.brink : PALETTE.ink));
    for (const c of d.doublings.slice(0, 4)) {
      f.g.append('line').attr('class', 'doubling').attr('x1', x(c)).attr('x2', x(c)).attr('y1', 0).attr('y2', f.height)
        .attr('stroke', PALETTE.brink).attr('stroke-dasharray', '3 3');
    }
    if (d.chaosOnset !== null && d.chaosOnset >= x.domain()[0]! && d.chaosOnset <= x.domain()[1]!) {
      f.g.append('line').attr('class', 'chaos-onset').attr('x1', x(d.chaosOnset)).attr('x2', x(d.chaosOnset)).attr('y1', 0).attr('y2', f.height)
        .attr('stroke', PALETTE.danger).attr('stroke-dasharray', '6 3');
    }
    if (d.proposed !== null) {
      f.g.append('line').attr('class', 'proposed').attr('x1', x(d.proposed)).attr('x2', x(d.proposed)).attr('y1', 0).attr('y2', f.height)
        .attr('stroke', PALETTE.sea).attr('stroke-width', 2.2);
      f.g.append('text').attr('x', x(d.proposed) + 4).attr('y', 12).attr('fill', PALETTE.sea).text(`Proposed ${pct(d.proposed)}`);
    }
    const items: [string, string | null, string][] = [[PALETTE.brink, '3 3', 'Period doubling']];
    if (d.chaosOnset !== null) items.push([PALETTE.danger, '6 3', 'Onset of chaos']);
    if (d.proposed !== null) items.push([PALETTE.sea, null, 'Proposed rate (band: bootstrap 90%)']);
    legend(f, items);
  }
}
