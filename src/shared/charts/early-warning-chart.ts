import { ChangeDetectionStrategy, Component, ElementRef, effect, input, viewChild } from '@angular/core';
import { line, scaleLinear } from 'd3';
import type { EarlyWarning } from '../../../api/engine/diagnostics/early-warning';
import { PALETTE, axes, frame } from './chart-kit';
import { containerWidth } from './container-width';

/** Rolling variance and lag-1 autocorrelation of survey residuals, with Kendall's τ of each trend. */
@Component({
  selector: 'bm-early-warning-chart',
  template: `<div class="bm-ew"><svg #v data-chart="ew-variance" role="img" aria-label="Rolling variance"></svg><svg #a data-chart="ew-autocorrelation" role="img" aria-label="Rolling autocorrelation"></svg></div>`,
  styles: `:host { display: block; } .bm-ew { display: grid; grid-template-columns: 1fr 1fr; gap: 8px; }
    @media (max-width: 959.98px) { .bm-ew { grid-template-columns: 1fr; } }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EarlyWarningChart {
  readonly data = input.required<EarlyWarning>();
  private readonly v = viewChild.required<ElementRef<SVGSVGElement>>('v');
  private readonly a = viewChild.required<ElementRef<SVGSVGElement>>('a');
  /** Two panels side by side on a wide screen, stacked on a narrow one. */
  private readonly drawWidth = containerWidth(() => 1088);

  constructor() {
    effect(() => {
      const d = this.data();
      const w = this.drawWidth();
      const panel = w >= 720 ? Math.floor((w - 8) / 2) : w;
      this.panel(this.v().nativeElement, panel, d.years, d.variance, `Rolling variance (τ = ${d.tauVariance.toFixed(2)})`, PALETTE.sea, null);
      // A correlation lies in [−1, 1]: a fixed scale keeps the line clear of both axes.
      this.panel(this.a().nativeElement, panel, d.years, d.autocorrelation, `Lag-1 autocorrelation (τ = ${d.tauAutocorrelation.toFixed(2)})`, PALETTE.brink, [-1, 1]);
    });
  }

  private panel(svg: SVGSVGElement, width: number, years: number[], values: number[], label: string, colour: string, fixed: [number, number] | null): void {
    const f = frame(svg, width, 260);
    const x = scaleLinear().domain([years[0]!, years[years.length - 1]!]).range([0, f.width]);
    const lo = Math.min(0, ...values), hi = Math.max(...values);
    const pad = (hi - lo) * 0.1 || 1;
    const y = scaleLinear().domain(fixed ?? [lo < 0 ? lo - pad : 0, hi + pad]).range([f.height, 0]).nice();
    axes(f, x, y, `Window ending (year)`, label, (v) => String(Math.round(v)));
    f.g.append('path').attr('d', line<number>().x((_, i) => x(years[i]!)).y((v) => y(v))(values)).attr('fill', 'none').attr('stroke', colour).attr('stroke-width', 2.2);
  }
}
