import { ChangeDetectionStrategy, Component, ElementRef, effect, input, viewChild } from '@angular/core';
import { axisLeft, line, scaleLinear, select } from 'd3';
import { PALETTE, axes, frame, legend } from './chart-kit';
import { containerWidth, heightFor } from './container-width';

export interface FitChartData {
  years: number[];
  name: string;
  observed: (number | null)[];
  fitted: number[];
  residuals: (number | null)[];
}

/** Observed survey index with the fitted path (q̂·B), and a panel of log residuals below. */
@Component({
  selector: 'bm-fit-chart',
  styles: `:host { display: block; }`,
  template: `<svg #svg data-chart="fit" role="img" aria-label="Observed survey index and fitted path"></svg>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FitChart {
  readonly data = input.required<FitChartData>();
  readonly width = input(760);
  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly drawWidth = containerWidth(() => this.width());

  constructor() {
    effect(() => this.draw(this.data(), this.drawWidth()));
  }

  private draw(d: FitChartData, width: number): void {
    const svgEl = this.svg().nativeElement;
    const f = frame(svgEl, width, heightFor(width, 420));
    const top = f.height * 0.66;
    const x = scaleLinear().domain([d.years[0]!, d.years[d.years.length - 1]!]).range([0, f.width]);
    const vals = [...d.observed.filter((v): v is number => v !== null), ...d.fitted];
    const y = scaleLinear().domain([0, Math.max(...vals) * 1.08]).range([top - 24, 0]);
    const upper = { ...f, height: top - 24 };
    axes(upper, x, y, '', `${d.name} (index)`, (v) => String(Math.round(v)));
    f.g.append('path').attr('d', line<number>().x((_, i) => x(d.years[i]!)).y((v) => y(v))(d.fitted)).attr('fill', 'none').attr('stroke', PALETTE.sea).attr('stroke-width', 2.4);
    f.g.append('g').selectAll('circle').data(d.observed.map((v, i) => [d.years[i]!, v] as const).filter((p) => p[1] !== null))
      .join('circle').attr('cx', (p) => x(p[0])).attr('cy', (p) => y(p[1]!)).attr('r', 3.5).attr('fill', '#fff').attr('stroke', PALETTE.ink).attr('stroke-width', 1.5)
      .append('title').text((p) => `${p[0]}: ${p[1]}`);
    legend(upper, [[PALETTE.sea, null, 'Fitted q·B'], [PALETTE.ink, 'circle', 'Observed index']]);
    const rMax = Math.max(0.1, ...d.residuals.filter((v): v is number => v !== null).map(Math.abs)) * 1.1;
    const r = scaleLinear().domain([-rMax, rMax]).range([f.height, top + 8]);
    const lower = f.g.append('g').attr('class', 'residual-panel');
    lower.append('g').attr('class', 'residual-axis').call(axisLeft(r).ticks(4).tickFormat((v) => (+v).toFixed(1)));
    lower.append('line').attr('x1', 0).attr('x2', f.width).attr('y1', r(0)).attr('y2', r(0)).attr('stroke', PALETTE.muted);
    lower.selectAll('rect').data(d.residuals.map((v, i) => [d.years[i]!, v] as const).filter((p) => p[1] !== null)).join('rect')
      .attr('x', (p) => x(p[0]) - 3).attr('width', 6).attr('y', (p) => Math.min(r(0), r(p[1]!))).attr('height', (p) => Math.abs(r(p[1]!) - r(0)))
      .attr('fill', (p) => (p[1]! >= 0 ? PALETTE.sea : PALETTE.brink)).append('title').text((p) => `${p[0]}: residual ${p[1]!.toFixed(3)}`);
    select(svgEl).select('g').append('g').attr('transform', `translate(0,${f.height})`).call((g) => g.append('text').attr('x', f.width / 2).attr('y', 36).attr('text-anchor', 'middle').attr('fill', PALETTE.muted).text('Year'));
    for (const t of x.ticks(Math.max(2, Math.min(8, Math.floor(f.width / 70))))) lower.append('text').attr('x', x(t)).attr('y', f.height + 16).attr('text-anchor', 'middle').attr('fill', PALETTE.ink).text(String(t));
    lower.append('text').attr('transform', `translate(-52,${(f.height + top) / 2}) rotate(-90)`).attr('text-anchor', 'middle').attr('fill', PALETTE.muted).text('log residual');
  }
}
