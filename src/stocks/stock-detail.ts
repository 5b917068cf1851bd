import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTabsModule } from '@angular/material/tabs';
import { switchMap } from 'rxjs';
import { DatasetPanel } from '../datasets/dataset-panel';
import { ProposalList } from '../proposals/proposal-list';
import { RunPanel } from '../runs/run-panel';
import { StockApi } from './stock-api';

@Component({
  selector: 'bm-stock-detail',
  imports: [RouterLink, MatTabsModule, MatIconModule, MatProgressBarModule, DatasetPanel, RunPanel, ProposalList],
  template: `
    @if (stock(); as s) {
      <a routerLink="/stocks" class="bm-back"><mat-icon>arrow_back</mat-icon>Stocks</a>
      <h1 class="bm-title">{{ s.name }}</h1>
      <p class="bm-lead">{{ s.region.name }} · {{ s.kind === 'predator-prey' ? 'linked predator and prey' : 'single stock' }} · in {{ s.unit === 't' ? 'tonnes' : s.unit }} · {{ s.description }}</p>
      <mat-tab-group animationDuration="0ms" [mat-stretch-tabs]="false">
        <mat-tab label="Data"><ng-template matTabContent><bm-dataset-panel [stockId]="s.id" /></ng-template></mat-tab>
        <mat-tab label="Model runs"><ng-template matTabContent><bm-run-panel [stock]="s" /></ng-template></mat-tab>
        <mat-tab label="Proposals"><ng-template matTabContent><bm-proposal-list [stockId]="s.id" /></ng-template></mat-tab>
      </mat-tab-group>
    } @else {
      <mat-progress-bar mode="indeterminate" />
    }
  `,
  styles: `.bm-back { display: inline-flex; align-items: center; gap: 4px; text-decoration: none; margin-bottom: 8px; font-size: 14px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockDetail {
  readonly id = input.required<string>();
  private readonly api = inject(StockApi);
  private readonly stockId = computed(() => Number(this.id()));
  protected readonly stock = toSignal(toObservable(this.stockId).pipe(switchMap((id) => this.api.get(id))));
}
