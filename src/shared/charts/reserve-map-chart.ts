import { ChangeDetectionStrategy, Component, ElementRef, effect, input, viewChild } from '@angular/core';
import { interpolateCividis, scaleLinear, scaleSequential, select } from 'd3';
import { PALETTE, frame } from './chart-kit';
import { containerWidth } from './container-width';

export interface ReserveMapData {
  nx: number;
  ny: number;
  /** Cell width (km). */
  h: number;
  cells: number[];
  reserve: number[];
  density: number[];
  /** Top of the colour scale (e.g. K), shared by maps compared side by side. */
  max: number;
  /** Unit of density, e.g. "t/km²". */
  unit: string;
}

/**
 * Equilibrium density map: cividis scale (readable by colour-blind readers and in grey, its lightness
 * rises monotonically), reserve cells outlined, a legend with units, the coast or grid in km.
 */
@Component({
  selector: 'bm-reserve-map-chart',
  styles: `:host { display: block; }`,
  template: `<svg #svg data-chart="reserve-map" role="img" aria-label="Equilibrium density map with reserves outlined"></svg>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReserveMapChart {
  readonly data = input.required<ReserveMapData>();
  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly drawWidth = containerWidth(() => 560);

  constructor() {
    effect(() => this.draw(this.data(), this.drawWidth()));
  }

  private draw(d: ReserveMapData, width: number): void {
    const coast = d.ny === 1;
    const legendH = 46;
    const plotW = width - 86;
    const cell = coast ? plotW / d.nx : Math.min(plotW / d.nx, 420 / d.ny);
    const mapH = coast ? 56 : cell * d.ny;
    const f = frame(this.svg().nativeElement, width, mapH + legendH + 62);
    const colour = scaleSequential(interpolateCividis).domain([0, Math.max(d.max, 1e-12)]);
    const map = f.g.append('g').attr('class', 'cells');
    const xy = d.cells.map((g) => ({ x: g % d.nx, y: Math.floor(g / d.nx) }));
    map.selectAll('rect').data(d.cells).join('rect')
      .attr('x', (_, i) => xy[i]!.x * cell).attr('y', (_, i) => (coast ? 0 : xy[i]!.y * cell))
      .attr('width', cell + 0.3).attr('height', coast ? mapH : cell + 0.3)
      .attr('fill', (_, i) => colour(Math.max(0, d.density[i]!)))
      .append('title').text((_, i) => `${d.density[i]!.toPrecision(3)} ${d.unit}${d.reserve[i] ? ' (reserve)' : ''}`);
    // reserve outline: every cell edge between a reserve cell and anything else
    const isRes = new Set(d.cells.filter((_, i) => d.reserve[i]));
    const edges: [number, number, number, number][] = [];
    for (const g of isRes) {
      const x = g % d.nx, y = Math.floor(g / d.nx);
      const y0 = coast ? 0 : y * cell, y1 = coast ? mapH : (y + 1) * cell;
      if (x === 0 || !isRes.has(g - 1)) edges.push([x * cell, y0, x * cell, y1]);
      if (x === d.nx - 1 || !isRes.has(g + 1)) edges.push([(x + 1) * cell, y0, (x + 1) * cell, y1]);
      if (!coast && (y === 0 || !isRes.has(g - d.nx))) edges.push([x * cell, y0, (x + 1) * cell, y0]);
      if (!coast && (y === d.ny - 1 || !isRes.has(g + d.nx))) edges.push([x * cell, y1, (x + 1) * cell, y1]);
      if (coast) { edges.push([x * cell, 0, (x + 1) * cell, 0]); edges.push([x * cell, mapH, (x + 1) * cell, mapH]); }
    }
    f.g.append('g').attr('class', 'reserve-outline').selectAll('line').data(edges).join('line')
      .attr('x1', (e) => e[0]).attr('y1', (e) => e[1]).attr('x2', (e) => e[2]).attr('y2', (e) => e[3])
      .attr('stroke', '#ffffff').attr('stroke-width', 3.2).clone(true).attr('stroke', PALETTE.danger).attr('stroke-width', 1.6).attr('stroke-dasharray', '5 2');
    const km = scaleLinear().domain([0, d.nx * d.h]).range([0, d.nx * cell]);
    const axis = f.g.append('g').attr('transform', `translate(0,${mapH + 4})`);
    for (const t of km.ticks(6)) {
      axis.append('line').attr('x1', km(t)).attr('x2', km(t)).attr('y1', 0).attr('y2', 4).attr('stroke', PALETTE.muted);
      axis.append('text').attr('x', km(t)).attr('y', 16).attr('text-anchor', 'middle').attr('fill', PALETTE.muted).text(String(t));
    }
    axis.append('text').attr('x', km.range()[1]! / 2).attr('y', 30).attr('text-anchor', 'middle').attr('fill', PALETTE.muted).text(coast ? 'Along the coast (km)' : 'East–west (km)');
    this.legend(f.g, colour, d, mapH + 44, Math.min(260, plotW));
  }

  private legend(g: ReturnType<typeof select<SVGGElement, unknown>> | ReturnType<typeof frame>['g'], colour: (v: number) => string, d: ReserveMapData, top: number, w: number): void {
    const l = g.append('g').attr('class', 'legend').attr('transform', `translate(0,${top})`);
    const steps = 40;
    for (let i = 0; i < steps; i++) l.append('rect').attr('x', (i * w) / steps).attr('y', 0).attr('width', w / steps + 0.5).attr('height', 10).attr('fill', colour((d.max * (i + 0.5)) / steps));
    l.append('text').attr('x', 0).attr('y', 24).attr('fill', PALETTE.muted).text('0');
    l.append('text').attr('x', w).attr('y', 24).attr('text-anchor', 'end').attr('fill', PALETTE.muted).text(`${d.max.toPrecision(3)} ${d.unit}`);
    l.append('text').attr('x', w / 2).attr('y', 24).attr('text-anchor', 'middle').attr('fill', PALETTE.ink).text('Equilibrium density');
    const key = l.append('g').attr('transform', `translate(${w + 18},0)`);
    key.append('rect').attr('width', 18).attr('height', 10).attr('fill', 'none').attr('stroke', PALETTE.danger).attr('stroke-dasharray', '5 2').attr('stroke-width', 1.6);
    key.append('text').attr('x', 24).attr('y', 9).attr('fill', PALETTE.ink).text('Reserve');
  }
}
