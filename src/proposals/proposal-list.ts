import { DatePipe, DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatTableModule } from '@angular/material/table';
import { firstValueFrom } from 'rxjs';
import type { ProposalListItem } from '../../api/proposals/proposal.schemas';
import { StandingPipe } from './proposal-standing.pipe';
import { ProposalApi } from './proposal-api';

@Component({
  selector: 'bm-proposal-list',
  imports: [RouterLink, DatePipe, DecimalPipe, PercentPipe, MatTableModule, StandingPipe],
  template: `
    <div class="bm-scroll"><table mat-table [dataSource]="proposals()" class="bm-table" data-testid="proposal-table">
      <ng-container matColumnDef="id"><th mat-header-cell *matHeaderCellDef>Proposal</th><td mat-cell *matCellDef="let p"><a [routerLink]="['/proposals', p.id]">#{{ p.id }}</a></td></ng-container>
      <ng-container matColumnDef="status"><th mat-header-cell *matHeaderCellDef>Status</th><td mat-cell *matCellDef="let p" data-testid="proposal-standing">{{ p | standing }}@if (p.submittedAt) { <div class="bm-sub">submitted {{ p.submittedAt | date: 'd MMM y' }}</div> }</td></ng-container>
      <ng-container matColumnDef="quota"><th mat-header-cell *matHeaderCellDef>Quota</th><td mat-cell *matCellDef="let p">{{ p.quota | number: '1.0-0' }} {{ p.figures.unit }}</td></ng-container>
      <ng-container matColumnDef="margin"><th mat-header-cell *matHeaderCellDef>Margin to fold</th><td mat-cell *matCellDef="let p">{{ p.figures.marginToFold.absolute | number: '1.0-0' }} ({{ p.figures.marginToFold.fraction | percent: '1.0-1' }})</td></ng-container>
      <ng-container matColumnDef="risk"><th mat-header-cell *matHeaderCellDef>P(pass fold)</th><td mat-cell *matCellDef="let p">{{ p.figures.atQuota.pPassFold | percent: '1.1-1' }}</td></ng-container>
      <ng-container matColumnDef="by"><th mat-header-cell *matHeaderCellDef>By</th><td mat-cell *matCellDef="let p">{{ p.createdByName }}</td></ng-container>
      <tr mat-header-row *matHeaderRowDef="cols"></tr>
      <tr mat-row *matRowDef="let row; columns: cols"></tr>
      <tr class="mat-row" *matNoDataRow><td class="mat-cell bm-empty" [attr.colspan]="cols.length">No proposals yet. Draft one from a finished run with a bootstrap.</td></tr>
    </table></div>
  `,
  styles: `.bm-table { width: 100%; background: #fff; border: 1px solid var(--bm-line); margin-top: 16px; } .bm-empty { padding: 14px; color: var(--bm-muted); } .bm-sub { color: var(--bm-muted); font-size: 12.5px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProposalList {
  readonly stockId = input.required<number>();
  private readonly api = inject(ProposalApi);
  protected readonly proposals = signal<ProposalListItem[]>([]);
  protected readonly cols = ['id', 'status', 'quota', 'margin', 'risk', 'by'];

  constructor() {
    queueMicrotask(async () => this.proposals.set(await firstValueFrom(this.api.listForStock(this.stockId()))));
  }
}
