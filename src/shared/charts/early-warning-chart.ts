import { ChangeDetectionStrategy, Component, ElementRef, effect, input, viewChild } from '@angular/core';
import { line, scaleLinear } from 'd3';
import type { EarlyWarning } from '../../../api/engine/diagnostics/early-warning';
import { PALETTE, axes, frame } from './chart-kit';

/** Rolling variance and lag-1 autocorrelation of survey residuals, with Kendall's τ of each trend. */
@Component({
  selector: 'bm-early-warning-chart',
  template: `<div class="bm-ew"><svg #v data-chart="ew-variance" role="img" aria-label="Rolling variance"></svg><svg #a data-chart="ew-autocorrelation" role="img" aria-label="Rolling autocorrelation"></svg></div>`,
  styles: `.bm-ew { display: grid; grid-template-columns: 1fr 1fr; gap: 8px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EarlyWarningChart {
  readonly data = input.required<EarlyWarning>();
  private readonly v = viewChild.required<ElementRef<SVGSVGElement>>('v');
  private readonly a = viewChild.required<ElementRef<SVGSVGElement>>('a');

  constructor() {
    effect(() => {
      const d = this.data();
      this.panel(this.v().nativeElement, d.years, d.variance, `Rolling variance (τ = ${d.tauVariance.toFixed(2)})`, PALETTE.sea);
      this.panel(this.a().nativeElement, d.years, d.autocorrelation, `Lag-1 autocorrelation (τ = ${d.tauAutocorrelation.toFixed(2)})`, PALETTE.brink);
    });
  }

  private panel(svg: SVGSVGElement, years: number[], values: number[], label: string, colour: string): void {
    const f = frame(svg, 540, 260);
    const x = scaleLinear().domain([years[0]!, years[years.length - 1]!]).range([0, f.width]);
    const lo = Math.min(0, ...values), hi = Math.max(...values);
    const y = scaleLinear().domain([lo, hi + (hi - lo) * 0.1 || 1]).range([f.height, 0]);
    axes(f, x, y, `Window ending (year)`, label, (v) => String(Math.round(v)));
    f.g.append('path').attr('d', line<number>().x((_, i) => x(years[i]!)).y((v) => y(v))(values)).attr('fill', 'none').attr('stroke', colour).attr('stroke-width', 2.2);
  }
}
