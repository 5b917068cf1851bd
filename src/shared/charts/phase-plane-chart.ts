import { ChangeDetectionStrategy, Component, ElementRef, effect, input, viewChild } from '@angular/core';
import { line, scaleLinear } from 'd3';
import { PALETTE, axes, frame, legend, short } from './chart-kit';
import { containerWidth, heightFor } from './container-width';

export interface PhasePlaneData {
  prey: number[];
  predator: number[];
  years: number[];
  preyNullcline: [number, number][];
  predatorNullcline: number | null;
  equilibrium: { prey: number; predator: number; stable: boolean } | null;
  unit: string;
}

/** Prey against predator: fitted trajectory, both nullclines and the equilibrium. */
@Component({
  selector: 'bm-phase-plane-chart',
  styles: `:host { display: block; }`,
  template: `<svg #svg data-chart="phase-plane" role="img" aria-label="Phase plane of prey and predator"></svg>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PhasePlaneChart {
  readonly data = input.required<PhasePlaneData>();
  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly drawWidth = containerWidth(() => 560);

  constructor() {
    effect(() => this.draw(this.data(), this.drawWidth()));
  }

  private draw(d: PhasePlaneData, width: number): void {
    const f = frame(this.svg().nativeElement, width, heightFor(width, 420));
    const x = scaleLinear().domain([0, Math.max(...d.prey, d.equilibrium?.prey ?? 0) * 1.25]).range([0, f.width]);
    const y = scaleLinear().domain([0, Math.max(...d.predator, d.equilibrium?.predator ?? 0) * 1.35]).range([f.height, 0]);
    axes(f, x, y, `Prey biomass (${d.unit})`, `Predator biomass (${d.unit})`);
    const clipped = d.preyNullcline.filter(([n, p]) => n <= x.domain()[1]! && p <= y.domain()[1]! && p >= 0);
    f.g.append('path').attr('d', line<[number, number]>().x((p) => x(p[0])).y((p) => y(p[1]))(clipped)).attr('fill', 'none').attr('stroke', PALETTE.prey).attr('stroke-dasharray', '6 4').attr('stroke-width', 1.8);
    if (d.predatorNullcline !== null) {
      f.g.append('line').attr('x1', x(d.predatorNullcline)).attr('x2', x(d.predatorNullcline)).attr('y1', 0).attr('y2', f.height).attr('stroke', PALETTE.predator).attr('stroke-dasharray', '6 4').attr('stroke-width', 1.8);
    }
    f.g.append('path').attr('d', line<number>().x((v) => x(v)).y((_, i) => y(d.predator[i]!))(d.prey)).attr('fill', 'none').attr('stroke', PALETTE.ink).attr('stroke-width', 2);
    f.g.selectAll('circle.year').data(d.prey).join('circle').attr('class', 'year').attr('cx', (v) => x(v)).attr('cy', (_, i) => y(d.predator[i]!)).attr('r', 2.4).attr('fill', PALETTE.ink)
      .append('title').text((v, i) => `${d.years[i] ?? ''}: prey ${short(v)}, predator ${short(d.predator[i]!)}`);
    if (d.equilibrium) {
      f.g.append('circle').attr('class', 'equilibrium').attr('cx', x(d.equilibrium.prey)).attr('cy', y(d.equilibrium.predator)).attr('r', 6)
        .attr('fill', d.equilibrium.stable ? PALETTE.sea : '#fff').attr('stroke', PALETTE.ink).attr('stroke-width', 1.5);
      f.g.append('text').attr('x', x(d.equilibrium.prey) + 9).attr('y', y(d.equilibrium.predator) - 8).attr('fill', PALETTE.ink)
        .text(`${d.equilibrium.stable ? 'Stable' : 'Unstable'} equilibrium`);
    }
    legend(f, [[PALETTE.ink, null, 'Fitted trajectory'], [PALETTE.prey, '6 4', 'Prey nullcline'], [PALETTE.predator, '6 4', 'Predator nullcline']]);
  }
}
