/** Shared d3 pieces for Brinkmark charts: frame, axes with units, number formats, palette. */
import { axisBottom, axisLeft, format, select, type ScaleLinear, type Selection } from 'd3';

export const PALETTE = {
  ink: '#0d3b47', sea: '#1f6f7f', brink: '#e08a1e', danger: '#b3261e', band: '#9cc9d1', muted: '#5a6b70', grid: '#e3eaec',
  prey: '#1f6f7f', predator: '#8a4f9e',
};

export interface Frame {
  g: Selection<SVGGElement, unknown, null, undefined>;
  width: number;
  height: number;
}

export const MARGIN = { top: 16, right: 20, bottom: 44, left: 66 };

/** Clears the svg and returns the inner drawing area. */
export function frame(svg: SVGSVGElement, width: number, height: number): Frame {
  const s = select(svg);
  s.selectAll('*').remove();
  s.attr('viewBox', `0 0 ${width} ${height}`).attr('width', '100%').attr('height', null).style('max-width', `${width * 1.25}px`).style('display', 'block')
    .attr('font-family', "'Source Sans 3', sans-serif").attr('font-size', 12).style('background', '#fff');
  const g = s.append('g').attr('transform', `translate(${MARGIN.left},${MARGIN.top})`);
  return { g, width: width - MARGIN.left - MARGIN.right, height: height - MARGIN.top - MARGIN.bottom };
}

/** Short numbers for labels: 12,300 → 12.3k. */
export const short = (v: number) => (Math.abs(v) >= 1e4 ? format('.3~s')(v) : format(',.4~r')(v));

/** One number format for every tick of an axis, chosen from its largest tick (no "20k" beside "5,000"). */
export function tickFormat(ticks: number[]): (v: number) => string {
  const top = Math.max(0, ...ticks.map(Math.abs));
  if (top >= 1e4) {
    const f = format('~s');
    return (v) => (v === 0 ? '0' : f(v));
  }
  return format(',~g');
}

/** How many ticks fit along an axis of this length (about one per 80 px). */
export const tickCount = (length: number, most: number) => Math.max(2, Math.min(most, Math.floor(length / 80)));

/** Draws both axes with grid lines and labels. */
export function axes(f: Frame, x: ScaleLinear<number, number>, y: ScaleLinear<number, number>, xLabel: string, yLabel: string, xFormat?: (v: number) => string): void {
  const yTicks = y.ticks(6);
  const xTicks = x.ticks(tickCount(f.width, 7));
  f.g.append('g').attr('class', 'grid').attr('stroke', PALETTE.grid)
    .call((g) => g.selectAll('line').data(yTicks).join('line').attr('x1', 0).attr('x2', f.width).attr('y1', (d) => y(d)).attr('y2', (d) => y(d)));
  const xf = xFormat ?? tickFormat(xTicks);
  const yf = tickFormat(yTicks);
  f.g.append('g').attr('class', 'x-axis').attr('transform', `translate(0,${f.height})`).call(axisBottom(x).tickValues(xTicks).tickFormat((v) => xf(+v)));
  f.g.append('g').attr('class', 'y-axis').call(axisLeft(y).tickValues(yTicks).tickFormat((v) => yf(+v)));
  f.g.append('text').attr('x', f.width / 2).attr('y', f.height + 36).attr('text-anchor', 'middle').attr('fill', PALETTE.muted).text(xLabel);
  f.g.append('text').attr('transform', `translate(${-52},${f.height / 2}) rotate(-90)`).attr('text-anchor', 'middle').attr('fill', PALETTE.muted).text(yLabel);
}

/** A legend key: a line (solid, or dashed with the given dash array) or an open circle for points. */
export type LegendKey = string | null | 'circle';

/** A legend row at the top right: [colour, key, label]. */
export function legend(f: Frame, items: [string, LegendKey, string][]): void {
  const l = f.g.append('g').attr('class', 'legend').attr('transform', `translate(${Math.max(4, f.width - 190)},4)`);
  items.forEach(([colour, key, label], i) => {
    const row = l.append('g').attr('transform', `translate(0,${i * 16})`);
    if (key === 'circle') {
      row.append('circle').attr('class', 'legend-point').attr('cx', 11).attr('cy', 6).attr('r', 3.5).attr('fill', '#fff').attr('stroke', colour).attr('stroke-width', 1.5);
    } else {
      row.append('line').attr('x1', 0).attr('x2', 22).attr('y1', 6).attr('y2', 6).attr('stroke', colour).attr('stroke-width', 2.2).attr('stroke-dasharray', key);
    }
    row.append('text').attr('x', 28).attr('y', 10).attr('fill', PALETTE.ink).text(label);
  });
}
