import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { PlanView, SubscriptionView } from '../../api/subscriptions/subscription.schemas';

@Injectable({ providedIn: 'root' })
export class SubscriptionApi {
  private readonly http = inject(HttpClient);

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
