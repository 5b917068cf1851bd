import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { firstValueFrom } from 'rxjs';
import type { DatasetView } from '../../api/datasets/dataset.schemas';
import { AuthStore } from '../core/auth/auth-store';
import { DatasetApi } from './dataset-api';
import { DatasetUpload } from './dataset-upload';

/** A stock's dataset versions (never overwritten) and, for assessors, the upload. */
@Component({
  selector: 'bm-dataset-panel',
  imports: [DatePipe, MatTableModule, MatButtonModule, MatIconModule, DatasetUpload],
  template: `
    @if (canUpload()) {
      <h3>Load a new version</h3>
      <bm-dataset-upload [stockId]="stockId()" (saved)="reload()" />
    }
    <h3>Versions</h3>
    <div class="bm-scroll"><table mat-table [dataSource]="versions()" class="bm-table" data-testid="version-table">
      <ng-container matColumnDef="version"><th mat-header-cell *matHeaderCellDef>Version</th><td mat-cell *matCellDef="let d"><strong>v{{ d.version }}</strong></td></ng-container>
      <ng-container matColumnDef="note"><th mat-header-cell *matHeaderCellDef>Note</th><td mat-cell *matCellDef="let d">{{ d.note }}</td></ng-container>
      <ng-container matColumnDef="years"><th mat-header-cell *matHeaderCellDef>Years</th><td mat-cell *matCellDef="let d">{{ d.firstYear }}–{{ d.lastYear }}</td></ng-container>
      <ng-container matColumnDef="indices"><th mat-header-cell *matHeaderCellDef>Surveys</th><td mat-cell *matCellDef="let d">{{ d.indexNames.join(', ') }}</td></ng-container>
      <ng-container matColumnDef="who"><th mat-header-cell *matHeaderCellDef>Saved by</th><td mat-cell *matCellDef="let d">{{ d.createdByName }}, {{ d.createdAt | date: 'd MMM y, HH:mm' }}</td></ng-container>
      <ng-container matColumnDef="csv"><th mat-header-cell *matHeaderCellDef></th>
        <td mat-cell *matCellDef="let d"><a mat-button [href]="csvUrl(d.id)" download><mat-icon>download</mat-icon>CSV</a></td></ng-container>
      <tr mat-header-row *matHeaderRowDef="cols"></tr>
      <tr mat-row *matRowDef="let row; columns: cols"></tr>
      <tr class="mat-row" *matNoDataRow><td class="mat-cell bm-empty" [attr.colspan]="cols.length">No data loaded yet.</td></tr>
    </table></div>
  `,
  styles: `h3 { color: var(--bm-ink); margin: 20px 0 10px; } .bm-table { width: 100%; background: #fff; border: 1px solid var(--bm-line); } .bm-empty { padding: 14px; color: var(--bm-muted); }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DatasetPanel {
  readonly stockId = input.required<number>();
  private readonly api = inject(DatasetApi);
  protected readonly versions = signal<DatasetView[]>([]);
  protected readonly cols = ['version', 'note', 'years', 'indices', 'who', 'csv'];
  private readonly auth = inject(AuthStore);
  protected readonly canUpload = () => this.auth.hasRole('assessor');

  constructor() {
    queueMicrotask(() => void this.reload());
  }

  async reload(): Promise<void> {
    this.versions.set(await firstValueFrom(this.api.list(this.stockId())));
  }

  protected csvUrl(id: number): string {
    return this.api.csvUrl(id);
  }
}
