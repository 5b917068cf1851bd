import { ChangeDetectionStrategy, Component, ElementRef, effect, input, signal, viewChild } from '@angular/core';
import { line, pointer, scaleLinear, select } from 'd3';
import type { FoldPoint } from '../../../api/engine/surplus/fold';
import { PALETTE, axes, frame, legend, short } from './chart-kit';
import { containerWidth, heightFor } from './container-width';

export interface BifurcationData {
  table: FoldPoint[];
  hStar: number;
  bFold: number;
  band: { p5: number; p95: number } | null;
  catches: { year: number; catch: number }[];
  quota: number | null;
  unit: string;
}

/**
 * Equilibrium biomass against constant harvest: stable branch solid, unstable threshold dashed,
 * the fold marked, the bootstrap band of the fold harvest shaded, historical catches and the
 * proposed quota as vertical lines. Hover shows both equilibria and the return rate (nearest
 * engine point; nothing is recomputed here).
 */
@Component({
  selector: 'bm-bifurcation-chart',
  template: `
    <svg #svg data-chart="bifurcation" role="img" aria-label="Bifurcation diagram: equilibrium biomass against harvest"></svg>
    @if (hover(); as h) {
      <div class="bm-tip" [style.left.px]="h.x" [style.top.px]="h.y" data-testid="bifurcation-tip">
        <strong>Harvest {{ h.h }}</strong><br />Stable equilibrium {{ h.stable }}<br />Unstable threshold {{ h.unstable }}<br />Return rate {{ h.rate }} /yr
      </div>
    }
  `,
  styles: `:host { display: block; position: relative; } .bm-tip { position: absolute; pointer-events: none; background: #fff; border: 1px solid var(--bm-line);
    border-radius: 6px; padding: 6px 10px; font-size: 12.5px; box-shadow: 0 2px 8px rgba(0,0,0,.12); white-space: nowrap; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BifurcationChart {
  readonly data = input.required<BifurcationData>();
  readonly width = input(1100);
  readonly height = input(430);
  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly drawWidth = containerWidth(() => this.width());
  protected readonly hover = signal<{ x: number; y: number; h: string; stable: string; unstable: string; rate: string } | null>(null);

  constructor() {
    effect(() => {
      const w = this.drawWidth();
      this.draw(this.data(), w, heightFor(w, this.height()));
    });
  }

  private draw(d: BifurcationData, width: number, height: number): void {
    const svgEl = this.svg().nativeElement;
    const f = frame(svgEl, width, height);
    const maxCatch = Math.max(0, ...d.catches.map((c) => c.catch));
    const xMax = Math.max(d.hStar * 1.15, maxCatch * 1.05, (d.quota ?? 0) * 1.05, d.band?.p95 ?? 0);
    const yMax = Math.max(...d.table.map((p) => p.stable)) * 1.05;
    const x = scaleLinear().domain([0, xMax]).range([0, f.width]);
    const y = scaleLinear().domain([0, yMax]).range([f.height, 0]);
    select(svgEl).attr('data-x-domain', `0,${xMax}`).attr('data-x-range', `${x.range()[0]},${x.range()[1]}`).attr('data-margin-left', 66);
    if (d.band) {
      f.g.append('rect').attr('class', 'fold-band').attr('x', x(d.band.p5)).attr('width', Math.max(1, x(d.band.p95) - x(d.band.p5)))
        .attr('y', 0).attr('height', f.height).attr('fill', PALETTE.band).attr('opacity', 0.35);
    }
    axes(f, x, y, `Constant harvest (${d.unit} per year)`, `Equilibrium biomass (${d.unit})`);
    const catches = f.g.append('g').attr('class', 'catches');
    for (const c of d.catches) {
      catches.append('line').attr('x1', x(c.catch)).attr('x2', x(c.catch)).attr('y1', f.height).attr('y2', f.height * 0.82)
        .attr('stroke', PALETTE.muted).attr('stroke-width', 1).attr('opacity', 0.5).append('title').text(`${c.year}: ${short(c.catch)} ${d.unit}`);
    }
    const path = line<[number, number]>().x((p) => x(p[0])).y((p) => y(p[1]));
    f.g.append('path').attr('class', 'stable-branch').attr('d', path(d.table.map((p) => [p.h, p.stable]))).attr('fill', 'none').attr('stroke', PALETTE.sea).attr('stroke-width', 2.6);
    f.g.append('path').attr('class', 'unstable-branch').attr('d', path(d.table.map((p) => [p.h, p.unstable]))).attr('fill', 'none').attr('stroke', PALETTE.danger).attr('stroke-width', 2).attr('stroke-dasharray', '6 4');
    if (d.quota !== null) {
      f.g.append('line').attr('class', 'quota-line').attr('x1', x(d.quota)).attr('x2', x(d.quota)).attr('y1', 0).attr('y2', f.height).attr('stroke', PALETTE.brink).attr('stroke-width', 2.4);
      f.g.append('text').attr('x', x(d.quota) - 6).attr('y', 14).attr('text-anchor', 'end').attr('fill', PALETTE.brink).attr('font-weight', 600).text(`Proposed ${short(d.quota)}`);
    }
    f.g.append('circle').attr('class', 'fold-marker').attr('data-h', d.hStar).attr('cx', x(d.hStar)).attr('cy', y(d.bFold)).attr('r', 6)
      .attr('fill', PALETTE.brink).attr('stroke', PALETTE.ink).attr('stroke-width', 1.5);
    f.g.append('text').attr('x', x(d.hStar) + 9).attr('y', y(d.bFold) + 4).attr('fill', PALETTE.ink).attr('font-weight', 600).text(`Fold h* = ${short(d.hStar)}`);
    legend(f, [[PALETTE.sea, null, 'Stable equilibrium'], [PALETTE.danger, '6 4', 'Unstable threshold'], [PALETTE.brink, null, 'Proposed quota'], [PALETTE.muted, null, 'Historical catches']]);
    const cursor = f.g.append('line').attr('stroke', PALETTE.ink).attr('stroke-dasharray', '2 3').attr('y1', 0).attr('y2', f.height).attr('opacity', 0);
    f.g.append('rect').attr('width', f.width).attr('height', f.height).attr('fill', 'transparent')
      .on('mousemove', (event: MouseEvent) => {
        const [mx, my] = pointer(event);
        const h = x.invert(mx);
        if (h > d.hStar) { this.hover.set(null); cursor.attr('opacity', 0); return; }
        const p = d.table.reduce((best, q) => (Math.abs(q.h - h) < Math.abs(best.h - h) ? q : best));
        cursor.attr('x1', x(p.h)).attr('x2', x(p.h)).attr('opacity', 0.7);
        const scale = svgEl.getBoundingClientRect().width / width || 1;
        this.hover.set({ x: Math.min((mx + 80) * scale, svgEl.getBoundingClientRect().width - 220), y: Math.max((my - 10) * scale, 0), h: `${short(p.h)} ${d.unit}/yr`, stable: `${short(p.stable)} ${d.unit}`, unstable: `${short(p.unstable)} ${d.unit}`, rate: p.returnRate.toFixed(3) });
      })
      .on('mouseleave', () => { this.hover.set(null); cursor.attr('opacity', 0); });
  }
}
