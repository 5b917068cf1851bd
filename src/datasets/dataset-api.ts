import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { CsvCheck, DatasetView } from '../../api/datasets/dataset.schemas';

@Injectable({ providedIn: 'root' })
export class DatasetApi {
  private readonly http = inject(HttpClient);

  list(stockId: number): Observable<DatasetView[]> {
    return this.http.get<{ datasets: DatasetView[] }>(`/api/stocks/${stockId}/datasets`).pipe(map((r) => r.datasets));
  }

  checkFile(stockId: number, file: File): Observable<CsvCheck> {
    const form = new FormData();
    form.append('file', file);
    return this.http.post<CsvCheck>(`/api/stocks/${stockId}/datasets/check`, form);
  }

  checkText(stockId: number, csv: string): Observable<CsvCheck> {
    return this.http.post<CsvCheck>(`/api/stocks/${stockId}/datasets/check`, { csv });
  }

  create(stockId: number, csv: string, note: string): Observable<DatasetView> {
    return this.http.post<{ dataset: DatasetView }>(`/api/stocks/${stockId}/datasets`, { csv, note }).pipe(map((r) => r.dataset));
  }

  csvUrl(id: number): string {
    return `/api/datasets/${id}/csv`;
  }
}
