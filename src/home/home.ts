import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { AuthStore } from '../core/auth/auth-store';
import { HOME_ACTIONS } from './home-actions';

@Component({
  selector: 'bm-home',
  imports: [RouterLink, MatCardModule, MatIconModule],
  template: `
    @if (view(); as v) {
      <h1 class="bm-title">Welcome, {{ name() }}</h1>
      <p class="bm-lead">{{ v.lead }}</p>
      <div class="bm-card-grid">
        @for (a of v.actions; track a.title) {
          <mat-card appearance="outlined" class="bm-action" [class.bm-soon]="!a.link">
            @if (a.link) {
              <a [routerLink]="a.link" class="bm-action-link">
                <mat-icon>{{ a.icon }}</mat-icon><h2>{{ a.title }}</h2><p>{{ a.text }}</p>
              </a>
            } @else {
              <div class="bm-action-link">
                <mat-icon>{{ a.icon }}</mat-icon><h2>{{ a.title }}</h2><p>{{ a.text }}</p>
                <span class="bm-none">Nothing waiting yet</span>
              </div>
            }
          </mat-card>
        }
      </div>
    }
  `,
  styles: `
    .bm-action { background: #fff; }
    .bm-action-link { display: block; padding: 20px; color: inherit; text-decoration: none; height: 100%; box-sizing: border-box; }
    a.bm-action-link:hover { background: #eef6f7; }
    .bm-action mat-icon { color: var(--bm-sea); font-size: 32px; width: 32px; height: 32px; }
    .bm-action h2 { margin: 10px 0 6px; font-size: 18px; color: var(--bm-ink); }
    .bm-action p { margin: 0; color: var(--bm-muted); }
    .bm-none { display: inline-block; margin-top: 10px; font-size: 12.5px; color: var(--bm-muted); border: 1px dashed var(--bm-line); padding: 2px 8px; border-radius: 10px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Home {
  private readonly auth = inject(AuthStore);
  protected readonly name = computed(() => this.auth.user()?.name ?? '');
  protected readonly view = computed(() => {
    const role = this.auth.user()?.role;
    return role ? HOME_ACTIONS[role] : null;
  });
}
