import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { debounceTime, switchMap } from 'rxjs';
import { AuthStore } from '../core/auth/auth-store';
import { AdvisoryApi } from './advisory-api';

/** Published advisories, newest first and searchable; licensees see their subscribed regions only. */
@Component({
  selector: 'bm-advisory-list',
  imports: [FormsModule, DatePipe, MatFormFieldModule, MatInputModule, MatIconModule],
  template: `
    <mat-form-field class="bm-search"><mat-label>Search advisories</mat-label><mat-icon matPrefix>search</mat-icon>
      <input matInput [ngModel]="q()" (ngModelChange)="q.set($event)" data-testid="advisory-search" /></mat-form-field>
    <div class="bm-list" data-testid="advisory-list">
      @for (a of advisories() ?? []; track a.id) {
        <article class="bm-adv" [class.bm-old]="a.supersededById">
          <div class="bm-adv-head"><strong>{{ a.title }}</strong>
            @if (a.override) { <span class="bm-flag">override</span> } @if (a.supersededById) { <span class="bm-flag bm-grey">superseded</span> }</div>
          <div class="bm-small">{{ a.docId }} · {{ a.regionName }} · published {{ a.publishedAt | date: 'd MMM y' }}</div>
          <p>{{ a.summary }}</p>
          <a [href]="pdf(a.id)" download data-testid="advisory-download"><mat-icon>picture_as_pdf</mat-icon>Download PDF</a>
          <span class="bm-small bm-sha">SHA-256 {{ a.sha256.slice(0, 16) }}…</span>
        </article>
      } @empty {
        <p class="bm-small">{{ isLicensee() ? 'No advisories for your subscribed regions yet.' : 'No advisories published yet.' }}</p>
      }
    </div>
  `,
  styles: `.bm-search { width: 100%; max-width: 480px; } .bm-list { display: flex; flex-direction: column; gap: 10px; }
    .bm-adv { background: #fff; border: 1px solid var(--bm-line); border-radius: 8px; padding: 12px 16px; } .bm-old { opacity: 0.7; }
    .bm-adv p { margin: 6px 0; } .bm-adv a { display: inline-flex; gap: 4px; align-items: center; } .bm-small { color: var(--bm-muted); font-size: 12.5px; }
    .bm-sha { margin-left: 12px; font-family: monospace; } .bm-flag { margin-left: 8px; background: var(--bm-danger); color: #fff; padding: 1px 8px; border-radius: 10px; font-size: 12px; } .bm-grey { background: var(--bm-muted); }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AdvisoryList {
  private readonly api = inject(AdvisoryApi);
  private readonly auth = inject(AuthStore);
  protected readonly q = signal('');
  protected readonly advisories = toSignal(toObservable(this.q).pipe(debounceTime(250), switchMap((q) => this.api.list(q))));
  protected readonly isLicensee = () => this.auth.hasRole('licensee');
  protected pdf(id: number): string {
    return this.api.pdfUrl(id);
  }
}
