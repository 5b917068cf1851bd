import { ChangeDetectionStrategy, Component, ElementRef, effect, input, viewChild } from '@angular/core';
import { line, scaleLinear } from 'd3';
import { axes, frame, legend } from './chart-kit';
import { containerWidth, heightFor } from './container-width';

export interface SeriesLine {
  label: string;
  colour: string;
  values: number[];
  dash?: string;
}

/** Several series against year on one axis (e.g. prey and predator biomass). */
@Component({
  selector: 'bm-series-chart',
  styles: `:host { display: block; }`,
  template: `<svg #svg data-chart="series" role="img" [attr.aria-label]="yLabel()"></svg>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SeriesChart {
  readonly years = input.required<number[]>();
  readonly lines = input.required<SeriesLine[]>();
  readonly yLabel = input('Biomass');
  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly drawWidth = containerWidth(() => 560);

  constructor() {
    effect(() => {
      const years = this.years(), lines = this.lines(), width = this.drawWidth();
      const f = frame(this.svg().nativeElement, width, heightFor(width, 420));
      const x = scaleLinear().domain([years[0]!, years[years.length - 1]!]).range([0, f.width]);
      const y = scaleLinear().domain([0, Math.max(...lines.flatMap((l) => l.values)) * 1.1]).range([f.height, 0]);
      axes(f, x, y, 'Year', this.yLabel(), (v) => String(Math.round(v)));
      for (const l of lines) {
        f.g.append('path').attr('d', line<number>().x((_, i) => x(years[i]!)).y((v) => y(v))(l.values.slice(0, years.length)))
          .attr('fill', 'none').attr('stroke', l.colour).attr('stroke-width', 2.2).attr('stroke-dasharray', l.dash ?? null);
      }
      legend(f, lines.map((l) => [l.colour, l.dash ?? null, l.label]));
    });
  }
}
