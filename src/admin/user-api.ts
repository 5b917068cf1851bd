import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { CreateUserBody, UpdateUserBody, UserView } from '../../api/users/user.schemas';

@Injectable({ providedIn: 'root' })
export class UserApi {
  private readonly http = inject(HttpClient);

  list(): Observable<UserView[]> {
    return this.http.get<{ users: UserView[] }>('/api/users').pipe(map((r) => r.users));
  }

  create(body: CreateUserBody): Observable<UserView> {
    return this.http.post<{ user: UserView }>('/api/users', body).pipe(map((r) => r.user));
  }

  resetPassword(id: number, password: string): Observable<UserView> {
    return this.http.post<{ user: UserView }>(`/api/users/${id}/password`, { password }).pipe(map((r) => r.user));
  }

  update(id: number, body: UpdateUserBody): Observable<UserView> {
    return this.http.patch<{ user: UserView }>(`/api/users/${id}`, body).pipe(map((r) => r.user));
  }
}
