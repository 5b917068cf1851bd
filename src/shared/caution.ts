import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** The caution that goes with every figure a decision could rest on. */
@Component({
  selector: 'bm-caution',
  imports: [MatIconModule],
  template: `<p class="bm-caution"><mat-icon>gavel</mat-icon>These figures are scientific advice to a competent authority, subject to local regulation and licensed practice.</p>`,
  styles: `.bm-caution { display: flex; gap: 8px; align-items: center; margin: 0; color: var(--bm-muted); font-size: 13px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Caution {}
