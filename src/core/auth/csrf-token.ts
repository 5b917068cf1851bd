import { Injectable, signal } from '@angular/core';

/** The session's CSRF token, sent by the interceptor on every state-changing request. */
@Injectable({ providedIn: 'root' })
export class CsrfToken {
  private readonly token = signal<string | null>(null);
  readonly value = this.token.asReadonly();

  set(token: string | null): void {
    this.token.set(token);
  }
}
