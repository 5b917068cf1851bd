import { ChangeDetectionStrategy, Component, ElementRef, effect, input, viewChild } from '@angular/core';
import { line, scaleLinear } from 'd3';
import { PALETTE, axes, frame, legend, short } from './chart-kit';
import { containerWidth, heightFor } from './container-width';

export interface CatchPlaneData {
  unit: string;
  preyMax: number;
  predatorMax: number;
  curves: { kind: 'fold' | 'hopf' | 'transcritical'; points: { preyCatch: number; predatorCatch: number }[] }[];
  /** Where bootstrap replicates first meet a curve along the ray through the pair. */
  cloud: { preyCatch: number; predatorCatch: number }[];
  current: { preyCatch: number; predatorCatch: number } | null;
  proposed: { preyCatch: number; predatorCatch: number } | null;
}

const COLOUR = { fold: PALETTE.danger, hopf: '#2e7d32', transcritical: PALETTE.predator } as const;

/** Prey catch against predator catch: fold, Hopf and predator-loss curves, the bootstrap cloud, the present and proposed pairs. */
@Component({
  selector: 'bm-catch-plane-chart',
  styles: `:host { display: block; }`,
  template: `<svg #svg data-chart="catch-plane" role="img" aria-label="Catch plane: fold, Hopf and predator-loss curves"></svg>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CatchPlaneChart {
  readonly data = input.required<CatchPlaneData>();
  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly drawWidth = containerWidth(() => 560);

  constructor() {
    effect(() => this.draw(this.data(), this.drawWidth()));
  }

  private draw(d: CatchPlaneData, width: number): void {
    const f = frame(this.svg().nativeElement, width, heightFor(width, 400));
    const x = scaleLinear().domain([0, d.preyMax]).range([0, f.width]);
    const y = scaleLinear().domain([0, d.predatorMax]).range([f.height, 0]);
    axes(f, x, y, `Prey catch (${d.unit}/yr)`, `Predator catch (${d.unit}/yr)`);
    const clip = (p: { preyCatch: number; predatorCatch: number }) => p.preyCatch <= d.preyMax && p.predatorCatch <= d.predatorMax;
    f.g.append('g').attr('class', 'cloud').selectAll('circle').data(d.cloud.filter(clip)).join('circle')
      .attr('cx', (p) => x(p.preyCatch)).attr('cy', (p) => y(p.predatorCatch)).attr('r', 2.2).attr('fill', PALETTE.band).attr('opacity', 0.8);
    for (const c of d.curves) {
      if (c.points.length === 1) {
        f.g.append('circle').attr('class', `curve-${c.kind}`).attr('cx', x(c.points[0]!.preyCatch)).attr('cy', y(c.points[0]!.predatorCatch)).attr('r', 5)
          .attr('fill', 'none').attr('stroke', COLOUR[c.kind]).attr('stroke-width', 2).append('title').text(`Predator lost at prey catch ${short(c.points[0]!.preyCatch)}`);
      } else if (c.points.length > 1) {
        f.g.append('path').attr('class', `curve-${c.kind}`).attr('d', line<{ preyCatch: number; predatorCatch: number }>().x((p) => x(p.preyCatch)).y((p) => y(p.predatorCatch))(c.points))
          .attr('fill', 'none').attr('stroke', COLOUR[c.kind]).attr('stroke-width', 2.2);
      }
    }
    const mark = (p: { preyCatch: number; predatorCatch: number } | null, fill: string, label: string) => {
      if (!p) return;
      f.g.append('circle').attr('class', 'pair').attr('cx', x(Math.min(p.preyCatch, d.preyMax))).attr('cy', y(Math.min(p.predatorCatch, d.predatorMax))).attr('r', 6)
        .attr('fill', fill).attr('stroke', PALETTE.ink).attr('stroke-width', 1.5).append('title').text(`${label}: prey ${short(p.preyCatch)}, predator ${short(p.predatorCatch)}`);
    };
    mark(d.current, '#fff', 'Last year');
    mark(d.proposed, PALETTE.brink, 'Proposed');
    legend(f, [[COLOUR.fold, null, 'Fold'], [COLOUR.hopf, null, 'Hopf (cycles)'], [COLOUR.transcritical, 'circle', 'Predator lost'], [PALETTE.band, 'circle', 'Bootstrap crossings']]);
  }
}
