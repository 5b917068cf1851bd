import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

export interface RegionView {
  id: number;
  code: string;
  name: string;
  description: string | null;
}

@Injectable({ providedIn: 'root' })
export class RegionApi {
  private readonly http = inject(HttpClient);

  list(): Observable<RegionView[]> {
    return this.http.get<{ regions: RegionView[] }>('/api/regions').pipe(map((r) => r.regions));
  }
}
