import { ChangeDetectionStrategy, Component, ElementRef, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';
import { exportPng, exportSvg } from './chart-export';

/** A titled card around one chart, with PNG and SVG export of the chart's svg. */
@Component({
  selector: 'bm-chart-frame',
  imports: [MatButtonModule, MatIconModule, MatTooltipModule],
  template: `
    <section class="bm-chart-card">
      <header>
        <div><h3>{{ title() }}</h3>@if (subtitle()) { <p>{{ subtitle() }}</p> }</div>
        <span class="bm-grow"></span>
        <button mat-icon-button matTooltip="Save as PNG" (click)="png()" aria-label="Save chart as PNG"><mat-icon>image</mat-icon></button>
        <button mat-icon-button matTooltip="Save as SVG" (click)="svg()" aria-label="Save chart as SVG"><mat-icon>download</mat-icon></button>
      </header>
      <div class="bm-chart-body"><ng-content /></div>
    </section>
  `,
  styles: `
    .bm-chart-card { background: #fff; border: 1px solid var(--bm-line); border-radius: 8px; padding: 12px 16px; }
    header { display: flex; align-items: flex-start; }
    h3 { margin: 0; font-size: 16px; color: var(--bm-ink); }
    p { margin: 2px 0 0; color: var(--bm-muted); font-size: 13px; }
    .bm-grow { flex: 1; }
    .bm-chart-body { position: relative; overflow-x: auto; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChartFrame {
  readonly title = input.required<string>();
  readonly subtitle = input<string>('');
  readonly fileName = input<string>('brinkmark-chart');

  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  private target(): SVGSVGElement | null {
    return this.host.nativeElement.querySelector('svg[data-chart]');
  }

  protected png(): void {
    const s = this.target();
    if (s) exportPng(s, this.fileName());
  }

  protected svg(): void {
    const s = this.target();
    if (s) exportSvg(s, this.fileName());
  }
}
