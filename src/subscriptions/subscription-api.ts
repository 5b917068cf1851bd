import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { PlanView, SubscriptionView } from '../../api/subscriptions/subscription.schemas';
import type { MailPreference } from '../../api/users/user.schemas';

@Injectable({ providedIn: 'root' })
export class SubscriptionApi {
  private readonly http = inject(HttpClient);

  setMailPreference(mailPreference: MailPreference): Observable<{ mailPreference: MailPreference }> {
    return this.http.put<{ mailPreference: MailPreference }>('/api/subscriptions/mail-preference', { mailPreference });
  }

  /** Abandons unfinished checkouts, which then leave the list. */
  abandonPending(): Observable<{ removed: number }> {
    return this.http.post<{ removed: number }>('/api/subscriptions/abandon-pending', {});
  }

  mine(): Observable<SubscriptionView[]> {
    return this.http.get<{ subscriptions: SubscriptionView[] }>('/api/subscriptions').pipe(map((r) => r.subscriptions));
  }

  plans(): Observable<PlanView[]> {
    return this.http.get<{ plans: PlanView[] }>('/api/subscriptions/plans').pipe(map((r) => r.plans));
  }

  checkout(regionId: number, plan: 'monthly' | 'yearly'): Observable<{ url: string }> {
    return this.http.post<{ url: string }>('/api/subscriptions/checkout', { regionId, plan });
  }

  cancel(id: number): Observable<unknown> {
    return this.http.post(`/api/subscriptions/${id}/cancel`, {});
  }
}
