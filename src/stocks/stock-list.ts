import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { MatTableModule } from '@angular/material/table';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { catchError, of } from 'rxjs';
import type { StockView } from '../../api/stocks/stock.schemas';
import { AuthStore } from '../core/auth/auth-store';
import { Notifier } from '../core/errors/notifier';
import { modelName } from '../shared/format';
import { StockApi } from './stock-api';

@Component({
  selector: 'bm-stock-list',
  imports: [RouterLink, MatTableModule, MatIconModule, MatProgressBarModule],
  templateUrl: './stock-list.html',
  styleUrl: './stock-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockList {
  private readonly notifier = inject(Notifier);
  private readonly auth = inject(AuthStore);
  protected readonly canOpen = () => !this.auth.hasRole('licensee');
  protected readonly columns = ['name', 'region', 'kind', 'unit', 'model'];
  protected readonly stocks = toSignal(
    inject(StockApi).list().pipe(catchError((err: Error) => {
      this.notifier.error(err.message);
      return of([] as StockView[]);
    })),
  );
  protected readonly modelLabel = modelName;
}
