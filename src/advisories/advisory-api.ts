import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { AdvisoryView } from '../../api/advisories/advisory.schemas';

@Injectable({ providedIn: 'root' })
export class AdvisoryApi {
  private readonly http = inject(HttpClient);

  list(q = ''): Observable<AdvisoryView[]> {
    const params = q ? new HttpParams().set('q', q) : undefined;
    return this.http.get<{ advisories: AdvisoryView[] }>('/api/advisories', { params }).pipe(map((r) => r.advisories));
  }

  pdfUrl(id: number): string {
    return `/api/advisories/${id}/pdf`;
  }
}
