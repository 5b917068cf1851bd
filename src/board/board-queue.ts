import { DatePipe, DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { MatTableModule } from '@angular/material/table';
import { StandingPipe } from '../proposals/proposal-standing.pipe';
import { BoardApi } from './board-api';

@Component({
  selector: 'bm-board-queue',
  imports: [RouterLink, DatePipe, DecimalPipe, PercentPipe, MatTableModule, StandingPipe],
  template: `
    <h1 class="bm-title">Proposals for the board</h1>
    <p class="bm-lead">Submitted quota proposals, newest first. Open one to read its figures, discuss, vote and (as chair) record the decision.</p>
    <div class="bm-scroll"><table mat-table [dataSource]="proposals() ?? []" class="bm-table" data-testid="board-queue">
      <ng-container matColumnDef="id"><th mat-header-cell *matHeaderCellDef>Proposal</th><td mat-cell *matCellDef="let p"><a [routerLink]="['/proposals', p.id]">#{{ p.id }}</a></td></ng-container>
      <ng-container matColumnDef="stock"><th mat-header-cell *matHeaderCellDef>Stock</th><td mat-cell *matCellDef="let p" data-testid="queue-stock"><strong>{{ p.stockName }}</strong><div class="bm-sub">{{ p.regionName }}</div></td></ng-container>
      <ng-container matColumnDef="quota"><th mat-header-cell *matHeaderCellDef>Quota</th><td mat-cell *matCellDef="let p">{{ p.quota | number: '1.0-0' }} {{ p.figures.unit }}</td></ng-container>
      <ng-container matColumnDef="margin"><th mat-header-cell *matHeaderCellDef>Margin to fold</th><td mat-cell *matCellDef="let p">{{ p.figures.marginToFold.absolute | number: '1.0-0' }} ({{ p.figures.marginToFold.fraction | percent: '1.1-1' }})</td></ng-container>
      <ng-container matColumnDef="risk"><th mat-header-cell *matHeaderCellDef>P(pass fold)</th><td mat-cell *matCellDef="let p">{{ p.figures.atQuota.pPassFold | percent: '1.1-1' }}</td></ng-container>
      <ng-container matColumnDef="submitted"><th mat-header-cell *matHeaderCellDef>Submitted</th><td mat-cell *matCellDef="let p" data-testid="queue-submitted">{{ p.submittedAt | date: 'd MMM y' }}<div class="bm-sub">by {{ p.createdByName ?? 'unknown' }}</div></td></ng-container>
      <ng-container matColumnDef="state"><th mat-header-cell *matHeaderCellDef>Board</th><td mat-cell *matCellDef="let p" data-testid="queue-state">{{ p | standing }}</td></ng-container>
      <tr mat-header-row *matHeaderRowDef="cols"></tr>
      <tr mat-row *matRowDef="let row; columns: cols"></tr>
      <tr class="mat-row" *matNoDataRow><td class="mat-cell bm-empty" [attr.colspan]="cols.length">Nothing has been submitted yet.</td></tr>
    </table></div>
  `,
  styles: `.bm-table { width: 100%; background: #fff; border: 1px solid var(--bm-line); } .bm-empty { padding: 14px; color: var(--bm-muted); }
    .bm-sub { color: var(--bm-muted); font-size: 12.5px; } td { white-space: nowrap; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BoardQueue {
  protected readonly proposals = toSignal(inject(BoardApi).queue());
  protected readonly cols = ['id', 'stock', 'quota', 'margin', 'risk', 'submitted', 'state'];
}
