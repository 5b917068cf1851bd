import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { OpenSessionView, SessionView } from '../../../api/auth/auth.schemas';

/** The sign-in endpoints. */
@Injectable({ providedIn: 'root' })
export class AuthApi {
  private readonly http = inject(HttpClient);

  csrf(): Observable<{ csrfToken: string }> {
    return this.http.get<{ csrfToken: string }>('/api/auth/csrf');
  }

  /** Who is signed in (user null for a visitor), answered without an error either way. */
  session(): Observable<OpenSessionView> {
    return this.http.get<OpenSessionView>('/api/auth/session');
  }

  me(): Observable<SessionView> {
    return this.http.get<SessionView>('/api/auth/me');
  }

  signIn(email: string, password: string): Observable<SessionView> {
    return this.http.post<SessionView>('/api/auth/sign-in', { email, password });
  }

  signOut(): Observable<void> {
    return this.http.post<void>('/api/auth/sign-out', {});
  }
}
