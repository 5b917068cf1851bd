import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatTableModule } from '@angular/material/table';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { catchError, of } from 'rxjs';
import type { StockView } from '../../api/stocks/stock.schemas';
import { Notifier } from '../core/errors/notifier';
import { StockApi } from './stock-api';

const MODEL_LABELS: Record<string, string> = {
  schaefer: 'Schaefer', 'pella-tomlinson': 'Pella-Tomlinson', fox: 'Fox',
  'lotka-volterra': 'Lotka-Volterra', 'rosenzweig-macarthur': 'Rosenzweig-MacArthur',
};

@Component({
  selector: 'bm-stock-list',
  imports: [MatTableModule, MatIconModule, MatProgressBarModule],
  templateUrl: './stock-list.html',
  styleUrl: './stock-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockList {
  private readonly notifier = inject(Notifier);
  protected readonly columns = ['name', 'region', 'kind', 'unit', 'model'];
  protected readonly stocks = toSignal(
    inject(StockApi).list().pipe(catchError((err: Error) => {
      this.notifier.error(err.message);
      return of([] as StockView[]);
    })),
  );
  protected modelLabel(code: string): string {
    return MODEL_LABELS[code] ?? code;
  }
}
