import { DatePipe, DecimalPipe, JsonPipe, NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { BoardView } from '../../api/board/board.schemas';
import type { ProposalView } from '../../api/proposals/proposal.schemas';
import { AuthStore } from '../core/auth/auth-store';
import { Notifier } from '../core/errors/notifier';
import { BoardApi } from './board-api';

/** The board's work on a submitted proposal: threaded comments, votes, the chair's decision and the audit log. */
@Component({
  selector: 'bm-board-panel',
  imports: [RouterLink, FormsModule, DatePipe, DecimalPipe, JsonPipe, NgTemplateOutlet, MatButtonModule, MatButtonToggleModule, MatCheckboxModule, MatFormFieldModule, MatInputModule, MatIconModule],
  templateUrl: './board-panel.html',
  styleUrl: './board-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BoardPanel {
  readonly proposal = input.required<ProposalView>();
  private readonly api = inject(BoardApi);
  private readonly notifier = inject(Notifier);
  protected readonly auth = inject(AuthStore);
  protected readonly view = signal<BoardView | null>(null);
  protected readonly replyTo = signal<number | null>(null);
  protected readonly isBoard = computed(() => this.auth.hasRole('board'));
  protected readonly isChair = computed(() => this.isBoard() && this.auth.user()?.boardChair === true);
  protected readonly count = computed(() => {
    const v = this.view()?.votes ?? [];
    return { approve: v.filter((x) => x.choice === 'approve').length, reject: v.filter((x) => x.choice === 'reject').length, abstain: v.filter((x) => x.choice === 'abstain').length };
  });
  protected readonly aboveLower = computed(() => this.limit > this.proposal().figures.foldHarvest.lower5);
  protected comment = '';
  protected reply = '';
  protected choice: 'approve' | 'reject' | 'abstain' = 'approve';
  protected voteReason = '';
  protected outcome: 'approved' | 'rejected' = 'approved';
  protected limit = 0;
  protected decisionReason = '';
  protected override = false;
  protected correctedLimit = 0;
  protected correctionReason = '';
  protected correctionOverride = false;

  constructor() {
    effect(() => {
      const p = this.proposal();
      this.limit = p.quota;
      this.correctedLimit = p.quota;
      void this.reload();
    });
  }

  protected async reload(): Promise<void> {
    this.view.set(await firstValueFrom(this.api.view(this.proposal().id)));
  }

  protected async postComment(parentId: number | null): Promise<void> {
    const body = parentId ? this.reply : this.comment;
    await this.act(() => firstValueFrom(this.api.comment(this.proposal().id, body, parentId)), 'Comment added.');
    this.comment = '';
    this.reply = '';
    this.replyTo.set(null);
  }

  protected async castVote(): Promise<void> {
    await this.act(() => firstValueFrom(this.api.vote(this.proposal().id, this.choice, this.voteReason)), 'Vote recorded.');
  }

  protected async decide(): Promise<void> {
    await this.act(() => firstValueFrom(this.api.decide(this.proposal().id, {
      outcome: this.outcome, reason: this.decisionReason, override: this.override, ...(this.outcome === 'approved' ? { limit: this.limit } : {}),
    })), this.outcome === 'approved' ? 'Decision recorded; the advisory is published.' : 'Decision recorded.');
  }

  protected async correct(advisoryId: number): Promise<void> {
    await this.act(() => firstValueFrom(this.api.supersede(advisoryId, this.correctedLimit, this.correctionReason, this.correctionOverride)), 'Correction published; it supersedes the earlier advisory.');
    this.correctionReason = '';
  }

  private async act(f: () => Promise<unknown>, ok: string): Promise<void> {
    try {
      await f();
      this.notifier.info(ok);
      await this.reload();
    } catch (err) {
      this.notifier.error(err instanceof Error ? err.message : 'That did not work.');
    }
  }
}
