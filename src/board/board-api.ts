import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { BoardView, RulesView } from '../../api/board/board.schemas';
import type { ProposalListItem } from '../../api/proposals/proposal.schemas';

@Injectable({ providedIn: 'root' })
export class BoardApi {
  private readonly http = inject(HttpClient);

  queue(): Observable<ProposalListItem[]> {
    return this.http.get<{ proposals: ProposalListItem[] }>('/api/board/proposals').pipe(map((r) => r.proposals));
  }

  view(proposalId: number): Observable<BoardView> {
    return this.http.get<BoardView>(`/api/proposals/${proposalId}/board`);
  }

  comment(proposalId: number, body: string, parentId: number | null): Observable<unknown> {
    return this.http.post(`/api/proposals/${proposalId}/board/comments`, { body, parentId });
  }

  vote(proposalId: number, choice: string, reason: string): Observable<unknown> {
    return this.http.post(`/api/proposals/${proposalId}/board/votes`, { choice, reason });
  }

  decide(proposalId: number, body: { outcome: string; limit?: number; reason: string; override: boolean }): Observable<{ decisionId: number; advisoryId: number | null }> {
    return this.http.post<{ decisionId: number; advisoryId: number | null }>(`/api/proposals/${proposalId}/board/decision`, body);
  }

  supersede(advisoryId: number, limit: number, reason: string, override: boolean): Observable<unknown> {
    return this.http.post(`/api/advisories/${advisoryId}/supersede`, { limit, reason, override });
  }

  rules(): Observable<RulesView> {
    return this.http.get<{ rules: RulesView }>('/api/board/rules').pipe(map((r) => r.rules));
  }

  setRules(rules: RulesView): Observable<unknown> {
    return this.http.put('/api/board/rules', rules);
  }
}
