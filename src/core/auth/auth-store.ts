import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { Role, UserView } from '../../../api/users/user.schemas';
import { AuthApi } from './auth-api';
import { CsrfToken } from './csrf-token';

/** Who is signed in, for the whole client. */
@Injectable({ providedIn: 'root' })
export class AuthStore {
  private readonly api = inject(AuthApi);
  private readonly csrf = inject(CsrfToken);
  private readonly current = signal<UserView | null>(null);

  readonly user = this.current.asReadonly();
  readonly signedIn = computed(() => this.current() !== null);

  /** Picks up an existing session at start-up (or fetches a CSRF token for the sign-in form). */
  async restore(): Promise<void> {
    try {
      const session = await firstValueFrom(this.api.session());
      this.current.set(session.user);
      this.csrf.set(session.csrfToken);
    } catch {
      this.current.set(null);
      await this.refreshToken();
    }
  }

  async signIn(email: string, password: string): Promise<UserView> {
    if (!this.csrf.value()) await this.refreshToken();
    const session = await firstValueFrom(this.api.signIn(email, password));
    this.accept(session.user, session.csrfToken);
    return session.user;
  }

  async signOut(): Promise<void> {
    try {
      await firstValueFrom(this.api.signOut());
    } finally {
      this.current.set(null);
      this.csrf.set(null);
      await this.refreshToken();
    }
  }

  hasRole(...roles: Role[]): boolean {
    const u = this.current();
    return u !== null && roles.includes(u.role);
  }

  private accept(user: UserView, token: string): void {
    this.current.set(user);
    this.csrf.set(token);
  }

  private async refreshToken(): Promise<void> {
    try {
      this.csrf.set((await firstValueFrom(this.api.csrf())).csrfToken);
    } catch {
      this.csrf.set(null);
    }
  }
}
