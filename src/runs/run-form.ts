import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal, viewChild } from '@angular/core';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { firstValueFrom } from 'rxjs';
import type { DatasetView } from '../../api/datasets/dataset.schemas';
import type { RunView } from '../../api/runs/run.schemas';
import type { StockView } from '../../api/stocks/stock.schemas';
import { ApiError } from '../core/errors/api-error';
import { ReserveStudyForm } from './reserve-study-form';
import { RunApi } from './run-api';

const SINGLE = [['schaefer', 'Schaefer'], ['pella-tomlinson', 'Pella-Tomlinson'], ['fox', 'Fox'],
  ['allee', 'Critical depensation (strong Allee effect)'], ['predation', 'Predation depensation (type III predator)'], ['ricker', 'Ricker (spawners and recruits)'],
  ['beverton-holt', 'Beverton-Holt (spawners and recruits)'], ['reaction-diffusion', 'Reaction-diffusion: reserve study']] as const;
const LINKED = [['rosenzweig-macarthur', 'Rosenzweig-MacArthur'], ['lotka-volterra', 'Lotka-Volterra (logistic prey)']] as const;

/** The ramp rule's trigger must lie above its limit; checked on the trigger so the message sits under it. */
function triggerAboveLimit(c: AbstractControl): ValidationErrors | null {
  const limit = c.parent?.get('limit')?.value as number | null | undefined;
  return typeof limit === 'number' && typeof c.value === 'number' && c.value <= limit ? { notAboveLimit: true } : null;
}

const fixedOrEstimate = (v: string): number | 'estimate' => (v.trim() === 'estimate' ? 'estimate' : Number(v));

/** Options of a new run, validated here and again by the server. */
@Component({
  selector: 'bm-run-form',
  imports: [ReserveStudyForm, ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule],
  templateUrl: './run-form.html',
  styles: `.bm-form { display: grid; grid-template-columns: repeat(auto-fill, minmax(190px, 1fr)); gap: 4px 14px; }
    .bm-actions { display: flex; gap: 12px; align-items: center; } .bm-err { color: var(--bm-danger); }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunForm {
  readonly stock = input.required<StockView>();
  readonly datasets = input.required<DatasetView[]>();
  readonly started = output<RunView>();
  private readonly api = inject(RunApi);
  private readonly study = viewChild(ReserveStudyForm);
  protected readonly models = computed(() => (this.stock().kind === 'predator-prey' ? LINKED : SINGLE));
  protected readonly linked = computed(() => this.stock().kind === 'predator-prey');

  protected readonly failure = signal<string | null>(null);
  protected readonly serverFields = signal<Record<string, string[]>>({});

  protected readonly form = inject(NonNullableFormBuilder).group({
    datasetId: [0, [Validators.required, Validators.min(1)]],
    model: ['', Validators.required],
    shape: [null as number | null, [Validators.min(0.05), Validators.max(5)]],
    bootstrap: [500, [Validators.required, Validators.min(0), Validators.max(5000)]],
    seed: [1, [Validators.required, Validators.min(0)]],
    risk: [0.05, [Validators.required, Validators.min(0.001), Validators.max(0.49)]],
    limit: [0.4, [Validators.required, Validators.min(0), Validators.max(2)]],
    control: ['catch' as 'catch' | 'F'],
    errors: ['observation' as 'observation' | 'state-space'],
    allowAboveK: [false],
    trigger: [0.8, [Validators.required, Validators.min(0.01), Validators.max(3), triggerAboveLimit]],
    fTarget: [1, [Validators.required, Validators.min(0.01), Validators.max(2)]],
    years: [10, [Validators.required, Validators.min(1), Validators.max(50)]],
    processSd: [0.1, [Validators.required, Validators.min(0), Validators.max(1)]],
    candidates: ['', Validators.pattern(/^\s*(\d+(\.\d+)?\s*(,\s*\d+(\.\d+)?\s*)*)?$/)],
    conversion: ['0.25', Validators.pattern(/^\s*(estimate|0?\.\d+|1(\.0*)?)\s*$/)],
    saturation: ['0.5', Validators.pattern(/^\s*(estimate|\d+(\.\d+)?)\s*$/)],
  });

  constructor() {
    const c = this.form.controls;
    // a linked refit integrates two species: fewer replicates by default
    queueMicrotask(() => { if (this.linked()) c.bootstrap.setValue(100, { emitEvent: false }); });
    c.limit.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => c.trigger.updateValueAndValidity({ emitEvent: false }));
    // A message about the last attempt goes as soon as the form changes.
    this.form.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => {
      this.failure.set(null);
      this.serverFields.set({});
    });
  }

  protected async submit(): Promise<void> {
    const dsId = this.form.controls.datasetId.value || this.datasets()[0]?.id || 0;
    const model = this.form.controls.model.value || this.models()[0]![0];
    this.form.patchValue({ datasetId: dsId, model });
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const v = this.form.getRawValue();
    this.failure.set(null);
    if (v.model === 'reaction-diffusion') {
      const spatial = this.study()?.value();
      if (!spatial) return;
      try {
        this.started.emit(await firstValueFrom(this.api.start({ datasetId: v.datasetId, model: 'reaction-diffusion', bootstrap: 0, spatial })));
      } catch (err) {
        if (err instanceof ApiError) this.serverFields.set(err.fields);
        this.failure.set(err instanceof Error ? err.message : 'The run could not be started.');
      }
      return;
    }
    try {
      const run = await firstValueFrom(this.api.start({
        datasetId: v.datasetId, model: v.model as never, bootstrap: v.bootstrap, seed: v.seed, risk: v.risk, limit: v.limit,
        trigger: v.trigger, fTarget: v.fTarget, years: v.years, processSd: v.processSd,
        ...(this.linked() ? {} : { control: v.control, errors: v.errors, allowAboveK: v.allowAboveK }),
        candidates: v.candidates.split(',').map((c) => c.trim()).filter(Boolean).map(Number),
        ...(v.model === 'pella-tomlinson' && v.shape ? { shape: v.shape } : {}),
        ...(this.linked() ? { conversion: fixedOrEstimate(v.conversion), saturation: fixedOrEstimate(v.saturation) } : {}),
      }));
      this.started.emit(run);
    } catch (err) {
      if (err instanceof ApiError) this.serverFields.set(err.fields);
      this.failure.set(err instanceof Error ? err.message : 'The run could not be started.');
    }
  }
}
