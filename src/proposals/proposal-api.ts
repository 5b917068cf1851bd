import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { ProposalListItem, ProposalView } from '../../api/proposals/proposal.schemas';

@Injectable({ providedIn: 'root' })
export class ProposalApi {
  private readonly http = inject(HttpClient);

  create(runId: number, quota: number, rationale: string, reserveDesign: { runId: number; index: number } | null = null, predatorQuota?: number): Observable<ProposalView> {
    return this.http.post<{ proposal: ProposalView }>('/api/proposals', { runId, quota, rationale, ...(reserveDesign ? { reserveDesign } : {}), ...(predatorQuota !== undefined ? { predatorQuota } : {}) }).pipe(map((r) => r.proposal));
  }

  update(id: number, patch: { quota?: number; predatorQuota?: number; rationale?: string }): Observable<ProposalView> {
    return this.http.patch<{ proposal: ProposalView }>(`/api/proposals/${id}`, patch).pipe(map((r) => r.proposal));
  }

  submit(id: number): Observable<ProposalView> {
    return this.http.post<{ proposal: ProposalView }>(`/api/proposals/${id}/submit`, {}).pipe(map((r) => r.proposal));
  }

  revise(id: number): Observable<ProposalView> {
    return this.http.post<{ proposal: ProposalView }>(`/api/proposals/${id}/revise`, {}).pipe(map((r) => r.proposal));
  }

  get(id: number): Observable<ProposalView> {
    return this.http.get<{ proposal: ProposalView }>(`/api/proposals/${id}`).pipe(map((r) => r.proposal));
  }

  listForStock(stockId: number): Observable<ProposalListItem[]> {
    return this.http.get<{ proposals: ProposalListItem[] }>(`/api/stocks/${stockId}/proposals`).pipe(map((r) => r.proposals));
  }
}
