import { ChangeDetectionStrategy, Component, ElementRef, effect, input, viewChild } from '@angular/core';
import { area, line, scaleLinear } from 'd3';
import { PALETTE, axes, frame, short } from './chart-kit';
import { containerWidth, heightFor } from './container-width';

export interface ProjectionChartData {
  startYear: number;
  unit: string;
  /** Limit reference point in biomass (for the horizontal line). */
  limit: number;
  candidates: { catchLevel: number; median: number[]; lower: number[]; upper: number[] }[];
  highlight: number | null;
}

const COLOURS = ['#1f6f7f', '#3f8f5a', '#e08a1e', '#b3261e', '#8a4f9e', '#5a6b70'];

/** Projected biomass per candidate quota: median line and 5–95% band, limit reference point marked. */
@Component({
  selector: 'bm-projection-chart',
  styles: `:host { display: block; }`,
  template: `<svg #svg data-chart="projection" role="img" aria-label="Projected biomass under candidate quotas"></svg>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectionChart {
  readonly data = input.required<ProjectionChartData>();
  readonly width = input(1100);
  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly drawWidth = containerWidth(() => this.width());

  constructor() {
    effect(() => this.draw(this.data(), this.drawWidth()));
  }

  private draw(d: ProjectionChartData, width: number): void {
    const f = frame(this.svg().nativeElement, width, heightFor(width, 380));
    const n = d.candidates[0]?.median.length ?? 1;
    const x = scaleLinear().domain([d.startYear, d.startYear + n - 1]).range([0, f.width]);
    const yMax = Math.max(d.limit, ...d.candidates.flatMap((c) => c.upper)) * 1.05;
    const y = scaleLinear().domain([0, yMax]).range([f.height, 0]);
    axes(f, x, y, 'Year', `Biomass (${d.unit})`, (v) => String(Math.round(v)));
    d.candidates.forEach((c, i) => {
      const colour = COLOURS[i % COLOURS.length]!;
      const strong = d.highlight === null || Math.round(d.highlight) === Math.round(c.catchLevel);
      f.g.append('path').attr('d', area<number>().x((_, k) => x(d.startYear + k)).y0((_, k) => y(c.lower[k]!)).y1((_, k) => y(c.upper[k]!))(c.median))
        .attr('fill', colour).attr('opacity', strong ? 0.16 : 0.05);
      f.g.append('path').attr('d', line<number>().x((_, k) => x(d.startYear + k)).y((v) => y(v))(c.median))
        .attr('fill', 'none').attr('stroke', colour).attr('stroke-width', strong ? 2.6 : 1.2);
      f.g.append('text').attr('x', f.width - 4).attr('y', y(c.median[c.median.length - 1]!) - 4).attr('text-anchor', 'end').attr('fill', colour).attr('font-weight', strong ? 600 : 400)
        .text(`catch ${short(c.catchLevel)}`);
    });
    f.g.append('line').attr('class', 'limit-line').attr('x1', 0).attr('x2', f.width).attr('y1', y(d.limit)).attr('y2', y(d.limit)).attr('stroke', PALETTE.danger).attr('stroke-dasharray', '6 4').attr('stroke-width', 1.6);
    f.g.append('text').attr('x', 6).attr('y', y(d.limit) - 5).attr('fill', PALETTE.danger).text(`Limit reference point ${short(d.limit)} ${d.unit}`);
  }
}
