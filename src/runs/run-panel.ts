import { DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { Router, RouterLink } from '@angular/router';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatTableModule } from '@angular/material/table';
import { firstValueFrom } from 'rxjs';
import type { DatasetView } from '../../api/datasets/dataset.schemas';
import type { RunSummary, RunView } from '../../api/runs/run.schemas';
import type { StockView } from '../../api/stocks/stock.schemas';
import { AuthStore } from '../core/auth/auth-store';
import { DatasetApi } from '../datasets/dataset-api';
import { ModelNamePipe } from '../shared/sig.pipe';
import { RunApi } from './run-api';
import { RunForm } from './run-form';

/** Model runs of a stock side by side, and (for assessors) a new run. */
@Component({
  selector: 'bm-run-panel',
  imports: [RouterLink, ModelNamePipe, DecimalPipe, PercentPipe, MatTableModule, MatExpansionModule, RunForm],
  template: `
    @if (isAssessor()) {
      <mat-expansion-panel class="bm-new" [expanded]="true">
        <mat-expansion-panel-header><mat-panel-title>New run</mat-panel-title></mat-expansion-panel-header>
        <bm-run-form [stock]="stock()" [datasets]="datasets()" (started)="open($event)" />
      </mat-expansion-panel>
    }
    <h3>Runs compared</h3>
    <div class="bm-scroll"><table mat-table [dataSource]="runs()" class="bm-table" data-testid="run-table">
      <ng-container matColumnDef="id"><th mat-header-cell *matHeaderCellDef>Run</th><td mat-cell *matCellDef="let r"><a [routerLink]="['/runs', r.id]">#{{ r.id }}</a></td></ng-container>
      <ng-container matColumnDef="model"><th mat-header-cell *matHeaderCellDef>Model</th><td mat-cell *matCellDef="let r">{{ r.model | modelName }}</td></ng-container>
      <ng-container matColumnDef="data"><th mat-header-cell *matHeaderCellDef>Data</th><td mat-cell *matCellDef="let r">v{{ r.datasetVersion }}</td></ng-container>
      <ng-container matColumnDef="status"><th mat-header-cell *matHeaderCellDef>Status</th>
        <td mat-cell *matCellDef="let r"><span class="bm-status bm-{{ r.status }}">{{ r.status }}</span>@if (r.status === 'running') { {{ r.progress | percent }} }</td></ng-container>
      <ng-container matColumnDef="loglik"><th mat-header-cell *matHeaderCellDef>log L</th><td mat-cell *matCellDef="let r">{{ r.logLik | number: '1.1-1' }}</td></ng-container>
      <ng-container matColumnDef="aic"><th mat-header-cell *matHeaderCellDef>AIC</th><td mat-cell *matCellDef="let r">{{ r.aic | number: '1.1-1' }}</td></ng-container>
      <ng-container matColumnDef="msy"><th mat-header-cell *matHeaderCellDef>MSY ({{ stock().unit }})</th><td mat-cell *matCellDef="let r">{{ r.msy | number: '1.0-0' }}</td></ng-container>
      <ng-container matColumnDef="fold"><th mat-header-cell *matHeaderCellDef>Fold h*</th><td mat-cell *matCellDef="let r">{{ r.foldHarvest | number: '1.0-0' }}</td></ng-container>
      <ng-container matColumnDef="b"><th mat-header-cell *matHeaderCellDef>B/B_MSY</th><td mat-cell *matCellDef="let r">{{ r.bOverBmsy | number: '1.2-2' }}</td></ng-container>
      <ng-container matColumnDef="f"><th mat-header-cell *matHeaderCellDef>F/F_MSY</th><td mat-cell *matCellDef="let r">{{ r.fOverFmsy | number: '1.2-2' }}</td></ng-container>
      <ng-container matColumnDef="quota"><th mat-header-cell *matHeaderCellDef>Proposed</th><td mat-cell *matCellDef="let r">{{ r.proposedQuota | number: '1.0-0' }}</td></ng-container>
      <tr mat-header-row *matHeaderRowDef="cols"></tr>
      <tr mat-row *matRowDef="let row; columns: cols"></tr>
      <tr class="mat-row" *matNoDataRow><td class="mat-cell bm-empty" [attr.colspan]="cols.length">No runs yet.</td></tr>
    </table></div>
  `,
  styles: `h3 { color: var(--bm-ink); margin: 20px 0 10px; } .bm-new { margin-top: 16px; } .bm-table { width: 100%; background: #fff; border: 1px solid var(--bm-line); }
    .bm-empty { padding: 14px; color: var(--bm-muted); } .bm-status { padding: 1px 8px; border-radius: 10px; font-size: 12.5px; background: #eef2f3; }
    .bm-succeeded { background: #e3f2e5; color: #2e7d32; } .bm-failed { background: #fdecea; color: var(--bm-danger); } .bm-running, .bm-queued { background: #fff4e0; color: #8a5a00; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunPanel {
  readonly stock = input.required<StockView>();
  private readonly api = inject(RunApi);
  private readonly datasetApi = inject(DatasetApi);
  private readonly router = inject(Router);
  private readonly auth = inject(AuthStore);
  protected readonly isAssessor = () => this.auth.hasRole('assessor');
  protected readonly runs = signal<RunSummary[]>([]);
  protected readonly datasets = signal<DatasetView[]>([]);
  protected readonly cols = ['id', 'model', 'data', 'status', 'loglik', 'aic', 'msy', 'fold', 'b', 'f', 'quota'];

  constructor() {
    queueMicrotask(async () => {
      this.datasets.set(await firstValueFrom(this.datasetApi.list(this.stock().id)));
      this.runs.set(await firstValueFrom(this.api.listForStock(this.stock().id)));
    });
  }

  protected open(run: RunView): void {
    void this.router.navigate(['/runs', run.id]);
  }
}
