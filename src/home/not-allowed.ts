import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatIconModule } from '@angular/material/icon';
import { AuthStore } from '../core/auth/auth-store';

const ROLE_NAMES: Record<string, string> = { admin: 'administrators', assessor: 'assessors', board: 'board members', licensee: 'licensees' };

/** Says why a page did not open: the signed-in role may not see it. */
@Component({
  selector: 'bm-not-allowed',
  imports: [RouterLink, MatIconModule],
  template: `
    <div class="bm-box" role="alert" data-testid="not-allowed">
      <mat-icon aria-hidden="true">lock</mat-icon>
      <div>
        <h1 class="bm-title">This page is not open to you</h1>
        <p>You are signed in as {{ article() }} <strong>{{ role() }}</strong>. The page <code>{{ page() || '/' }}</code> is for {{ allowed() }} only.</p>
        <p>If you need it for your work, ask an administrator to change your role. <a routerLink="/">Go to your home page</a>.</p>
      </div>
    </div>
  `,
  styles: `.bm-box { display: flex; gap: 14px; background: #fff; border: 1px solid var(--bm-line); border-left: 4px solid var(--bm-brink); border-radius: 8px; padding: 16px 20px; }
    .bm-box mat-icon { color: var(--bm-ink); margin-top: 6px; } p { margin: 6px 0; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotAllowed {
  readonly page = input<string>('');
  readonly roles = input<string>('');
  private readonly auth = inject(AuthStore);
  protected readonly role = computed(() => this.auth.user()?.role ?? '');
  protected readonly article = computed(() => (/^[aeiou]/.test(this.role()) ? 'an' : 'a'));
  protected readonly allowed = computed(() => {
    const names = this.roles().split(',').filter(Boolean).map((r) => ROLE_NAMES[r] ?? r);
    return names.length > 1 ? names.slice(0, -1).join(', ') + ' and ' + names[names.length - 1] : names[0] ?? 'other roles';
  });
}
