import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { firstValueFrom } from 'rxjs';
import { BoardApi } from '../board/board-api';
import { Notifier } from '../core/errors/notifier';

/** The administrator sets the board's quorum, majority and who may correct a published limit. */
@Component({
  selector: 'bm-board-rules',
  imports: [FormsModule, MatCheckboxModule, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule],
  template: `
    <mat-card appearance="outlined" class="bm-rules">
      <mat-card-header><mat-card-title>Board rules</mat-card-title></mat-card-header>
      <mat-card-content>
        <mat-form-field class="bm-wide"><mat-label>Quorum (votes cast)</mat-label><input matInput type="number" min="1" [(ngModel)]="quorum" data-testid="rules-quorum" /></mat-form-field>
        <mat-form-field class="bm-wide"><mat-label>Majority to approve (share of approve + reject)</mat-label><input matInput type="number" step="0.05" min="0.5" max="1" [(ngModel)]="majority" />
          <mat-hint>0.5 = more than half; 0.66 = two thirds</mat-hint></mat-form-field>
        <mat-checkbox [(ngModel)]="chairMayCorrect" data-testid="rules-chair-corrects">The chair may correct a published limit alone</mat-checkbox>
        <p class="bm-note">Otherwise a correction needs a new board vote: the assessor revises the proposal and the board votes on the revised limit. Either way the correction carries its own record.</p>
        <button mat-flat-button (click)="save()" [disabled]="!(quorum >= 1) || !(majority >= 0.5 && majority <= 1)">Save rules</button>
        @if (saved()) { <span class="bm-ok">Saved.</span> }
      </mat-card-content>
    </mat-card>
  `,
  styles: `.bm-rules { background: #fff; margin-top: 16px; } .bm-wide { width: 100%; } .bm-ok { margin-left: 10px; color: #2e7d32; } .bm-note { color: var(--bm-muted); font-size: 12.5px; margin: 0 0 10px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BoardRules {
  private readonly api = inject(BoardApi);
  private readonly notifier = inject(Notifier);
  protected quorum = 2;
  protected majority = 0.5;
  protected chairMayCorrect = true;
  protected readonly saved = signal(false);

  constructor() {
    void firstValueFrom(this.api.rules()).then((r) => { this.quorum = r.quorum; this.majority = r.majority; this.chairMayCorrect = r.chairMayCorrect; this.saved.set(false); });
  }

  protected async save(): Promise<void> {
    try {
      await firstValueFrom(this.api.setRules({ quorum: this.quorum, majority: this.majority, chairMayCorrect: this.chairMayCorrect }));
      this.saved.set(true);
    } catch (err) {
      this.notifier.error(err instanceof Error ? err.message : 'Could not save the rules.');
    }
  }
}
