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

/** Short numbers for axes and labels: 12,300 → 12.3k. */
export const short = (v: number) => (Math.abs(v) >= 1e4 ? format('.3~s')(v) : format(',.4~r')(v));

/** Draws both axes with grid lines and labels. */
export function axes(f: Frame, x: ScaleLinear<number, number>, y: ScaleLinear<number, number>, xLabel: string, yLabel: string, xFormat: (v: number) => string = short): void {
  f.g.append('g').attr('class', 'grid').attr('stroke', PALETTE.grid)
    .call((g) => g.selectAll('line').data(y.ticks(6)).join('line').attr('x1', 0).attr('x2', f.width).attr('y1', (d) => y(d)).attr('y2', (d) => y(d)));
  f.g.append('g').attr('transform', `translate(0,${f.height})`).call(axisBottom(x).ticks(7).tickFormat((v) => xFormat(+v)));
  f.g.append('g').call(axisLeft(y).ticks(6).tickFormat((v) => short(+v)));
  f.g.append('text').attr('x', f.width / 2).attr('y', f.height + 36).attr('text-anchor', 'middle').attr('fill', PALETTE.muted).text(xLabel);
  f.g.append('text').attr('transform', `translate(${-52},${f.height / 2}) rotate(-90)`).attr('text-anchor', 'middle').attr('fill', PALETTE.muted).text(yLabel);
}

/** A legend row at the top right: [colour, dash, label]. */
export function legend(f: Frame, items: [string, string | null, string][]): void {
  const l = f.g.append('g').attr('class', 'legend').attr('transform', `translate(${f.width - 190},4)`);
  items.forEach(([colour, dash, label], i) => {
    const row = l.append('g').attr('transform', `translate(0,${i * 16})`);
    row.append('line').attr('x1', 0).attr('x2', 22).attr('y1', 6).attr('y2', 6).attr('stroke', colour).attr('stroke-width', 2.2).attr('stroke-dasharray', dash);
    row.append('text').attr('x', 28).attr('y', 10).attr('fill', PALETTE.ink).text(label);
  });
}
