import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { firstValueFrom, map, of, switchMap } from 'rxjs';
import type { SpatialRunResults } from '../../api/runs/run.schemas';
import { RunApi } from '../runs/run-api';

/** Chooses a design from a finished reserve study of the stock to carry with a proposal (optional). */
@Component({
  selector: 'bm-reserve-design-picker',
  imports: [FormsModule, MatFormFieldModule, MatSelectModule],
  template: `
    @if (studies().length) {
      <div class="bm-row">
        <mat-form-field subscriptSizing="dynamic"><mat-label>Reserve study</mat-label>
          <mat-select [ngModel]="runId()" (ngModelChange)="pickRun($event)" data-testid="reserve-study">
            <mat-option [value]="null">None</mat-option>
            @for (s of studies(); track s.id) { <mat-option [value]="s.id">Run #{{ s.id }}</mat-option> }
          </mat-select></mat-form-field>
        @if (designs().length) {
          <mat-form-field subscriptSizing="dynamic"><mat-label>Design carried with the quota</mat-label>
            <mat-select [ngModel]="index()" (ngModelChange)="pickDesign($event)" data-testid="reserve-design">
              @for (d of designs(); track $index) { <mat-option [value]="$index">{{ d.name }}{{ d.persists ? '' : ' (stock does not persist)' }}</mat-option> }
            </mat-select></mat-form-field>
        }
      </div>
    }
  `,
  styles: `.bm-row { display: flex; gap: 12px; flex-wrap: wrap; } mat-form-field { min-width: 200px; flex: 1; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReserveDesignPicker {
  readonly stockId = input.required<number>();
  readonly chosen = output<{ runId: number; index: number } | null>();
  private readonly runs = inject(RunApi);
  protected readonly studies = toSignal(toObservable(this.stockId).pipe(
    switchMap((id) => this.runs.listForStock(id)),
    map((rs) => rs.filter((r) => r.model === 'reaction-diffusion' && r.status === 'succeeded')),
  ), { initialValue: [] });
  protected readonly runId = signal<number | null>(null);
  protected readonly index = signal(0);
  private readonly results = signal<SpatialRunResults | null>(null);
  protected readonly designs = computed(() => this.results()?.designs ?? []);

  protected async pickRun(id: number | null): Promise<void> {
    this.runId.set(id);
    this.index.set(0);
    this.results.set(id === null ? null : ((await firstValueFrom(id === null ? of(null) : this.runs.get(id)))?.results as SpatialRunResults) ?? null);
    this.chosen.emit(id === null ? null : { runId: id, index: 0 });
  }

  protected pickDesign(i: number): void {
    this.index.set(i);
    if (this.runId() !== null) this.chosen.emit({ runId: this.runId()!, index: i });
  }
}
