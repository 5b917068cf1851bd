import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NavigationEnd, Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { BreakpointObserver } from '@angular/cdk/layout';
import { filter, map } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatMenuModule } from '@angular/material/menu';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { AuthStore } from './core/auth/auth-store';
import { navFor } from './shell/nav';

/** Below this width the side navigation folds away behind the menu button. */
export const NARROW_QUERY = '(max-width: 959.98px)';

@Component({
  selector: 'bm-root',
  imports: [
    RouterOutlet, RouterLink, RouterLinkActive, MatToolbarModule, MatButtonModule, MatIconModule, MatMenuModule,
    MatSidenavModule, MatListModule,
  ],
  templateUrl: './app.html',
  styleUrl: './app.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class App {
  protected readonly auth = inject(AuthStore);
  private readonly router = inject(Router);
  protected readonly nav = computed(() => navFor(this.auth.user()?.role ?? null));
  protected readonly narrow = toSignal(inject(BreakpointObserver).observe(NARROW_QUERY).pipe(map((s) => s.matches)), {
    initialValue: false,
  });
  /** Open state of the folded navigation on a narrow screen; the wide layout always shows it. */
  protected readonly menuOpen = signal(false);
  protected readonly navOpen = computed(() => !this.narrow() || this.menuOpen());

  constructor() {
    this.router.events.pipe(filter((e) => e instanceof NavigationEnd)).subscribe(() => this.menuOpen.set(false));
  }

  protected async signOut(): Promise<void> {
    await this.auth.signOut();
    await this.router.navigateByUrl('/sign-in');
  }
}
