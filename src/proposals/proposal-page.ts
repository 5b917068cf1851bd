import { DatePipe, DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { firstValueFrom } from 'rxjs';
import type { ProposalView } from '../../api/proposals/proposal.schemas';
import type { PredatorPreyRunResults, SurplusRunResults } from '../../api/runs/run.schemas';
import { AuthStore } from '../core/auth/auth-store';
import { ApiError } from '../core/errors/api-error';
import { Notifier } from '../core/errors/notifier';
import { RunApi, type RunDetail } from '../runs/run-api';
import { BifurcationChart, type BifurcationData } from '../shared/charts/bifurcation-chart';
import { CatchPlaneChart, type CatchPlaneData } from '../shared/charts/catch-plane-chart';
import { BoardPanel } from '../board/board-panel';
import { Caution } from '../shared/caution';
import { ChartFrame } from '../shared/charts/chart-frame';
import { proposalStart } from '../shared/format';
import { ModelNamePipe } from '../shared/sig.pipe';
import { ProposalApi } from './proposal-api';
import { ProposalReserveDesign } from './proposal-reserve-design';
import { ReserveDesignPicker } from './reserve-design-picker';

/** Drafts a proposal from a run (route proposals/new?run=ID) or shows, edits and submits one (proposals/:id). */
@Component({
  selector: 'bm-proposal-page',
  imports: [Caution, FormsModule, RouterLink, ModelNamePipe, DatePipe, DecimalPipe, PercentPipe, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, MatProgressBarModule, ChartFrame, BifurcationChart, CatchPlaneChart, BoardPanel, ReserveDesignPicker, ProposalReserveDesign],
  templateUrl: './proposal-page.html',
  styleUrl: './proposal-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProposalPage {
  readonly id = input<string>();
  readonly run = input<string>();
  private readonly api = inject(ProposalApi);
  private readonly runs = inject(RunApi);
  private readonly router = inject(Router);
  private readonly notifier = inject(Notifier);
  protected readonly auth = inject(AuthStore);
  protected readonly proposal = signal<ProposalView | null>(null);
  protected readonly runDetail = signal<RunDetail | null>(null);
  protected readonly busy = signal(false);
  protected readonly fields = signal<Record<string, string[]>>({});
  protected quota = 0;
  protected predatorQuota = 0;
  protected rationale = '';
  protected readonly results = computed(() => { const r = this.runDetail()?.results; return r?.kind === 'surplus' ? (r as SurplusRunResults) : undefined; });
  protected readonly linkedResults = computed(() => { const r = this.runDetail()?.results; return r?.kind === 'predator-prey' ? (r as PredatorPreyRunResults) : undefined; });
  protected readonly plane = signal<CatchPlaneData | null>(null);
  protected readonly editable = computed(() => this.auth.hasRole('assessor') && (this.proposal()?.status ?? 'draft') === 'draft');
  protected readonly chart = signal<BifurcationData | null>(null);
  protected readonly reserveDesign = signal<{ runId: number; index: number } | null>(null);

  constructor() {
    effect(() => void this.load(this.id(), this.run()));
  }

  private async load(id: string | undefined, runId: string | undefined): Promise<void> {
    const p = id && id !== 'new' ? await firstValueFrom(this.api.get(Number(id))) : null;
    this.proposal.set(p);
    const rid = p?.runId ?? Number(runId);
    if (!rid) return;
    const detail = await firstValueFrom(this.runs.get(rid));
    this.runDetail.set(detail);
    const r = detail.results as SurplusRunResults;
    const lr = this.linkedResults();
    const last = lr ? lr.years.length - 1 : 0;
    this.quota = p?.quota ?? (lr ? lr.preyCatch[last]! : proposalStart(r.quota?.proposal.proposed, r.quota?.proposal.control));
    this.predatorQuota = p?.predatorQuota ?? (lr ? lr.predatorCatch[last]! : 0);
    this.rationale = p?.rationale ?? '';
    this.redraw();
  }

  protected redraw(): void {
    const lr = this.linkedResults();
    if (lr?.catchPlane) {
      const last = lr.years.length - 1;
      this.plane.set({
        unit: this.proposal()?.figures.unit ?? 't', preyMax: lr.catchPlane.preyMax, predatorMax: lr.catchPlane.predatorMax, curves: lr.catchPlane.curves,
        cloud: lr.current?.cloud ?? [], current: { preyCatch: lr.preyCatch[last]!, predatorCatch: lr.predatorCatch[last]! },
        proposed: { preyCatch: this.quota, predatorCatch: this.predatorQuota },
      });
    }
    const r = this.results();
    if (!r) return;
    this.chart.set({
      table: r.fold.table, hStar: r.fold.hStar, bFold: r.fold.bFold, unit: this.proposal()?.figures.unit ?? 't',
      band: r.bootstrap ? { p5: r.bootstrap.hStar.p5, p95: r.bootstrap.hStar.p95 } : null,
      catches: r.fit.years.map((year, i) => ({ year, catch: r.fit.catches[i]! })), quota: this.quota || null,
    });
  }

  protected async save(): Promise<void> {
    await this.act(async () => {
      const p = this.proposal();
      const saved = p
        ? await firstValueFrom(this.api.update(p.id, { quota: this.quota, rationale: this.rationale, ...this.pairPatch() }))
        : await firstValueFrom(this.api.create(this.runDetail()!.run.id, this.quota, this.rationale, this.reserveDesign(), this.linkedResults() ? this.predatorQuota : undefined));
      this.proposal.set(saved);
      this.notifier.info('Draft saved; the figures were recomputed for this quota.');
      if (!p) void this.router.navigate(['/proposals', saved.id], { replaceUrl: true });
    });
  }

  protected async submit(): Promise<void> {
    await this.act(async () => {
      const p = this.proposal()!;
      if (p.quota !== this.quota || p.rationale !== this.rationale || (this.linkedResults() && p.predatorQuota !== this.predatorQuota)) {
        await firstValueFrom(this.api.update(p.id, { quota: this.quota, rationale: this.rationale, ...this.pairPatch() }));
      }
      this.proposal.set(await firstValueFrom(this.api.submit(p.id)));
      this.notifier.info('Submitted to the quota board. The proposal is now frozen.');
    });
  }

  private pairPatch(): { predatorQuota?: number } {
    return this.linkedResults() ? { predatorQuota: this.predatorQuota } : {};
  }

  protected async revise(): Promise<void> {
    await this.act(async () => {
      const draft = await firstValueFrom(this.api.revise(this.proposal()!.id));
      void this.router.navigate(['/proposals', draft.id]);
    });
  }

  private async act(f: () => Promise<void>): Promise<void> {
    this.busy.set(true);
    try {
      await f();
      this.fields.set({});
    } catch (err) {
      if (err instanceof ApiError) this.fields.set(err.fields);
      this.notifier.error(err instanceof Error ? err.message : 'That did not work.');
    } finally {
      this.busy.set(false);
    }
  }
}
