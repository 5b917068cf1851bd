import { ChangeDetectionStrategy, Component, ElementRef, effect, input, viewChild } from '@angular/core';
import { line, scaleLinear } from 'd3';
import { PALETTE, axes, frame, legend } from './chart-kit';
import { containerWidth, heightFor } from './container-width';

export interface XyLine {
  label: string;
  colour: string;
  points: [number, number][];
  dash?: string;
}

/** Lines against a numeric x with optional vertical markers (fishing sweeps, recovery fronts). */
@Component({
  selector: 'bm-xy-chart',
  styles: `:host { display: block; }`,
  template: `<svg #svg data-chart="xy" role="img" [attr.aria-label]="yLabel()"></svg>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class XyChart {
  readonly lines = input.required<XyLine[]>();
  readonly xLabel = input('');
  readonly yLabel = input('');
  readonly markers = input<{ x: number; label: string }[]>([]);
  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly drawWidth = containerWidth(() => 560);

  constructor() {
    effect(() => {
      const lines = this.lines(), width = this.drawWidth();
      const f = frame(this.svg().nativeElement, width, heightFor(width, 360));
      const xs = lines.flatMap((l) => l.points.map((p) => p[0]));
      const ys = lines.flatMap((l) => l.points.map((p) => p[1]));
      const x = scaleLinear().domain([Math.min(0, ...xs), Math.max(1e-9, ...xs)]).range([0, f.width]);
      const y = scaleLinear().domain([0, Math.max(1e-9, ...ys) * 1.1]).range([f.height, 0]);
      axes(f, x, y, this.xLabel(), this.yLabel());
      for (const l of lines) {
        f.g.append('path').attr('d', line<[number, number]>().x((p) => x(p[0])).y((p) => y(p[1]))(l.points))
          .attr('fill', 'none').attr('stroke', l.colour).attr('stroke-width', 2.2).attr('stroke-dasharray', l.dash ?? null);
      }
      for (const m of this.markers()) {
        f.g.append('line').attr('class', 'marker').attr('x1', x(m.x)).attr('x2', x(m.x)).attr('y1', 0).attr('y2', f.height).attr('stroke', PALETTE.danger).attr('stroke-dasharray', '6 3');
        f.g.append('text').attr('x', x(m.x) - 4).attr('y', f.height - 6).attr('text-anchor', 'end').attr('fill', PALETTE.danger).text(m.label);
      }
      legend(f, lines.map((l) => [l.colour, l.dash ?? null, l.label]));
    });
  }
}
