import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { StockView } from '../../api/stocks/stock.schemas';

@Injectable({ providedIn: 'root' })
export class StockApi {
  private readonly http = inject(HttpClient);

  list(): Observable<StockView[]> {
    return this.http.get<{ stocks: StockView[] }>('/api/stocks').pipe(map((r) => r.stocks));
  }

  get(id: number): Observable<StockView> {
    return this.http.get<{ stock: StockView }>(`/api/stocks/${id}`).pipe(map((r) => r.stock));
  }
}
