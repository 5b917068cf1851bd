import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { SpatialRunOptions } from '../../api/runs/run.schemas';

const COAST_LINE = /^\s*([^:]{1,60}):\s*((\d+(\.\d+)?\s*-\s*\d+(\.\d+)?\s*)(,\s*\d+(\.\d+)?\s*-\s*\d+(\.\d+)?\s*)*)?$/;

/** Inputs of a reserve study: growth and movement, fishing outside, the coast or grid, and up to six designs. */
@Component({
  selector: 'bm-reserve-study-form',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule],
  template: `
    <div [formGroup]="form" class="bm-form">
      <mat-form-field subscriptSizing="dynamic"><mat-label>Growth</mat-label>
        <mat-select formControlName="growth"><mat-option value="logistic">Logistic</mat-option><mat-option value="allee">Strong Allee effect</mat-option></mat-select></mat-form-field>
      <mat-form-field subscriptSizing="dynamic"><mat-label>r (/yr)</mat-label><input matInput type="number" step="0.05" formControlName="r" data-testid="rd-r" />
        @if (form.controls.r.invalid) { <mat-error>Above 0, at most 20.</mat-error> }</mat-form-field>
      <mat-form-field subscriptSizing="dynamic"><mat-label>K (density)</mat-label><input matInput type="number" formControlName="K" />
        <mat-hint>per km of coast or km² of grid</mat-hint>@if (form.controls.K.invalid) { <mat-error>Above 0.</mat-error> }</mat-form-field>
      <mat-form-field subscriptSizing="dynamic"><mat-label>D (km²/yr)</mat-label><input matInput type="number" step="0.1" formControlName="D" />
        @if (form.controls.D.invalid) { <mat-error>Above 0.</mat-error> }</mat-form-field>
      @if (form.controls.growth.value === 'allee') {
        <mat-form-field subscriptSizing="dynamic"><mat-label>Allee threshold A (density)</mat-label><input matInput type="number" formControlName="A" />
          <mat-hint>Below K</mat-hint></mat-form-field>
      }
      <mat-form-field subscriptSizing="dynamic"><mat-label>Fishing mortality outside (/yr)</mat-label><input matInput type="number" step="0.05" formControlName="fishing" data-testid="rd-fishing" />
        @if (form.controls.fishing.invalid) { <mat-error>From 0 to 50.</mat-error> }</mat-form-field>
      <mat-form-field subscriptSizing="dynamic"><mat-label>Habitat</mat-label>
        <mat-select formControlName="kind" data-testid="rd-habitat"><mat-option value="coast">Coastline (1-D)</mat-option><mat-option value="grid">Grid from a mask (2-D)</mat-option></mat-select></mat-form-field>
      @if (form.controls.kind.value === 'coast') {
        <mat-form-field subscriptSizing="dynamic"><mat-label>Coast length (km)</mat-label><input matInput type="number" formControlName="length" /></mat-form-field>
        <mat-form-field subscriptSizing="dynamic"><mat-label>Cells along the coast</mat-label><input matInput type="number" formControlName="cells" />
          <mat-hint>20 to 1,000</mat-hint></mat-form-field>
      } @else {
        <mat-form-field subscriptSizing="dynamic"><mat-label>Cell width (km)</mat-label><input matInput type="number" step="0.1" formControlName="cellKm" /></mat-form-field>
      }
    </div>
    @if (form.controls.kind.value === 'coast') {
      <mat-form-field class="bm-wide" [formGroup]="form"><mat-label>Designs, one a line: name: from-to, from-to (km)</mat-label>
        <textarea matInput rows="4" formControlName="coastDesigns" data-testid="rd-coast-designs"></textarea>
        <mat-hint>e.g. "One large: 25-35" and "Two small: 10-15, 45-50"; a line with no reserve ("Open coast:") compares against none</mat-hint>
        @if (form.controls.coastDesigns.invalid) { <mat-error>Each line: a name, a colon, then reserves as from-to in km separated by commas (at most six lines).</mat-error> }
      </mat-form-field>
    } @else {
      @for (d of gridDesigns.controls; track $index; let i = $index) {
        <div class="bm-grid-design" [formGroup]="d">
          <mat-form-field subscriptSizing="dynamic"><mat-label>Design name</mat-label><input matInput formControlName="name" /></mat-form-field>
          <mat-form-field class="bm-wide"><mat-label>Mask CSV: 0 not habitat, 1 fished, 2 reserve; one line per row</mat-label>
            <textarea matInput rows="6" formControlName="maskCsv" class="bm-mono" [attr.data-testid]="'rd-mask-' + i"></textarea>
            @for (e of maskErrors(i); track $index) { <mat-hint class="bm-err">{{ e }}</mat-hint> }
          </mat-form-field>
          <div class="bm-row">
            <label mat-stroked-button class="bm-upload"><mat-icon>upload_file</mat-icon>Load a mask file<input type="file" accept=".csv,text/csv,text/plain" (change)="load($event, i)" hidden /></label>
            @if (gridDesigns.length > 1) { <button mat-button type="button" (click)="gridDesigns.removeAt(i)"><mat-icon>delete</mat-icon>Remove</button> }
          </div>
        </div>
      }
      @if (gridDesigns.length < 6) { <button mat-stroked-button type="button" (click)="addGridDesign()"><mat-icon>add</mat-icon>Add a design</button> }
    }
  `,
  styles: `.bm-form { display: grid; grid-template-columns: repeat(auto-fill, minmax(190px, 1fr)); gap: 4px 14px; } .bm-wide { width: 100%; }
    .bm-mono { font-family: monospace; } .bm-grid-design { border-top: 1px solid var(--bm-line); padding-top: 8px; margin-top: 8px; }
    .bm-row { display: flex; gap: 8px; align-items: center; } .bm-upload { cursor: pointer; } .bm-err { color: var(--bm-danger); }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReserveStudyForm {
  readonly serverFields = input<Record<string, string[]>>({});
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly gridDesigns = this.fb.array([this.gridDesign('Design A')]);
  readonly form = this.fb.group({
    growth: ['logistic' as 'logistic' | 'allee'],
    r: [0.5, [Validators.required, Validators.min(0.0001), Validators.max(20)]],
    K: [100, [Validators.required, Validators.min(0.0001)]],
    D: [2, [Validators.required, Validators.min(0.0001)]],
    A: [null as number | null],
    fishing: [0.8, [Validators.required, Validators.min(0), Validators.max(50)]],
    kind: ['coast' as 'coast' | 'grid'],
    length: [60, [Validators.required, Validators.min(0.001)]],
    cells: [200, [Validators.required, Validators.min(20), Validators.max(1000)]],
    cellKm: [1, [Validators.required, Validators.min(0.001)]],
    coastDesigns: ['One large: 25-35\nTwo small: 12-17, 43-48\nOpen coast:', [Validators.required, (c: { value: string }) => (c.value.split('\n').filter((l) => l.trim()).every((l) => COAST_LINE.test(l)) && c.value.split('\n').filter((l) => l.trim()).length <= 6 ? null : { lines: true })]],
    designs: this.gridDesigns,
  });

  private gridDesign(name: string) {
    return this.fb.group({ name: [name, [Validators.required, Validators.maxLength(60)]], maskCsv: ['', Validators.required] });
  }

  protected maskErrors(i: number): string[] {
    return this.serverFields()[`spatial.designs.${i}.maskCsv`] ?? [];
  }

  protected addGridDesign(): void {
    this.gridDesigns.push(this.gridDesign(`Design ${String.fromCharCode(65 + this.gridDesigns.length)}`));
  }

  protected load(ev: Event, i: number): void {
    const file = (ev.target as HTMLInputElement).files?.[0];
    if (!file) return;
    void file.text().then((t) => this.gridDesigns.at(i).patchValue({ maskCsv: t }));
  }

  /** The study as the API takes it, or null (with the fields marked) when something is missing. */
  value(): SpatialRunOptions | null {
    this.form.markAllAsTouched();
    const v = this.form.getRawValue();
    const coast = v.kind === 'coast';
    const c = this.form.controls;
    const own = [c.r, c.K, c.D, c.fishing, ...(coast ? [c.length, c.cells, c.coastDesigns] : [c.cellKm])];
    if (own.some((x) => x.invalid) || (!coast && this.gridDesigns.invalid)) return null;
    const designs = coast
      ? v.coastDesigns.split('\n').filter((l) => l.trim()).map((l) => {
        const [name, rest] = [l.slice(0, l.indexOf(':')).trim(), l.slice(l.indexOf(':') + 1)];
        const reserves = rest.split(',').map((p) => p.trim()).filter(Boolean).map((p) => p.split('-').map(Number) as [number, number]);
        return { name, reserves };
      })
      : v.designs.map((d) => ({ name: d.name, maskCsv: d.maskCsv }));
    return {
      growth: v.growth, r: v.r, K: v.K, D: v.D, ...(v.growth === 'allee' && v.A ? { A: v.A } : {}), fishing: v.fishing,
      habitat: coast ? { kind: 'coast', length: v.length, cells: v.cells } : { kind: 'grid', cellKm: v.cellKm },
      designs,
    };
  }
}
