import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal, viewChild } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { firstValueFrom } from 'rxjs';
import type { CsvCheck, CsvProblem, DatasetView } from '../../api/datasets/dataset.schemas';
import { ApiError } from '../core/errors/api-error';
import { Notifier } from '../core/errors/notifier';
import { toCsv } from './csv-cells';
import { DatasetApi } from './dataset-api';

interface Row {
  line: number;
  cells: string[];
}

/** Upload a CSV, see it as an editable table with every problem marked, and save it as a new version once clean. */
@Component({
  selector: 'bm-dataset-upload',
  imports: [FormsModule, MatTableModule, MatSortModule, MatPaginatorModule, MatButtonModule, MatIconModule, MatFormFieldModule, MatInputModule, MatProgressBarModule],
  templateUrl: './dataset-upload.html',
  styleUrl: './dataset-upload.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DatasetUpload {
  readonly stockId = input.required<number>();
  readonly saved = output<DatasetView>();
  private readonly api = inject(DatasetApi);
  private readonly notifier = inject(Notifier);

  protected readonly fileName = signal<string | null>(null);
  protected readonly check = signal<CsvCheck | null>(null);
  protected readonly header = signal<string[]>([]);
  protected readonly busy = signal(false);
  protected readonly dirty = signal(false);
  protected readonly dragging = signal(false);
  protected note = '';
  protected readonly data = new MatTableDataSource<Row>([]);
  protected readonly columns = computed(() => ['line', ...this.header().map((_, i) => `c${i}`)]);
  protected readonly problems = computed<CsvProblem[]>(() => { const c = this.check(); return c && !c.ok ? c.errors : []; });
  protected readonly cellErrors = computed(() => new Map(this.problems().filter((p) => p.column).map((p) => [`${p.line}:${p.column}`, p.problem])));
  protected readonly rowErrors = computed(() => new Set(this.problems().map((p) => p.line)));
  protected readonly clean = computed(() => this.check()?.ok === true && !this.dirty());

  private readonly sort = viewChild(MatSort);
  private readonly paginator = viewChild(MatPaginator);

  constructor() {
    this.data.sortingDataAccessor = (row, col) => (col === 'line' ? row.line : Number(row.cells[Number(col.slice(1))]) || row.cells[Number(col.slice(1))] || '');
    effect(() => {
      const s = this.sort(), p = this.paginator();
      if (s) this.data.sort = s;
      if (p) this.data.paginator = p;
    });
  }

  protected onDrop(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(false);
    const file = event.dataTransfer?.files[0];
    if (file) void this.load(file);
  }

  protected onPick(event: Event): void {
    const file = (event.target as HTMLInputElement).files?.[0];
    if (file) void this.load(file);
  }

  protected async load(file: File): Promise<void> {
    this.fileName.set(file.name);
    await this.run(() => firstValueFrom(this.api.checkFile(this.stockId(), file)));
  }

  protected edit(row: Row, col: number, value: string): void {
    row.cells[col] = value.trim();
    this.dirty.set(true);
  }

  protected async recheck(): Promise<void> {
    const csv = toCsv(this.header(), this.currentRows());
    await this.run(() => firstValueFrom(this.api.checkText(this.stockId(), csv)));
  }

  protected async save(): Promise<void> {
    if (!this.clean()) return;
    this.busy.set(true);
    try {
      const d = await firstValueFrom(this.api.create(this.stockId(), toCsv(this.header(), this.currentRows()), this.note));
      this.notifier.info(`Saved as version ${d.version}.`);
      this.saved.emit(d);
      this.reset();
    } catch (err) {
      this.notifier.error(err instanceof ApiError ? err.message : 'Could not save the dataset.');
    } finally {
      this.busy.set(false);
    }
  }

  protected errorAt(line: number, col: number): string | undefined {
    return this.cellErrors().get(`${line}:${this.header()[col]}`);
  }

  protected reset(): void {
    this.check.set(null);
    this.header.set([]);
    this.data.data = [];
    this.fileName.set(null);
    this.note = '';
    this.dirty.set(false);
  }

  private currentRows(): string[][] {
    return [...this.data.data].sort((a, b) => a.line - b.line).map((r) => r.cells);
  }

  private async run(call: () => Promise<CsvCheck>): Promise<void> {
    this.busy.set(true);
    try {
      const c = await call();
      this.check.set(c);
      this.header.set(c.header);
      this.data.data = c.rows.map((cells, i) => ({ line: i + 2, cells: [...cells] }));
      this.dirty.set(false);
    } catch (err) {
      this.notifier.error(err instanceof ApiError ? err.message : 'The file could not be checked.');
    } finally {
      this.busy.set(false);
    }
  }
}
