import { DatePipe } from '@angular/common';
import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { firstValueFrom } from 'rxjs';

interface OutboxRow { id: number; toAddress: string; subject: string; status: string; attempts: number; lastError: string | null; sentAt: string | null; createdAt: string }
interface Received { file: string; to: string; subject: string; date: string | null; attachments: string[] }
interface Message { subject: string; from: string; to: string; text: string; attachments: { filename: string; size: number }[] }

/** Administrator's view of outgoing mail: the outbox with retries and errors, and what the SMTP fake received. */
@Component({
  selector: 'bm-mail-outbox',
  imports: [DatePipe, MatButtonModule],
  template: `
    <h1 class="bm-title">Mail outbox</h1>
    <p class="bm-lead">Every e-mail Brinkmark queued, with its attempts; and the messages the local mail server received.</p>
    @if (data(); as d) {
      <h3>Queued and sent</h3>
      <div class="bm-scroll"><table class="bm-t" data-testid="outbox"><thead><tr><th>#</th><th>To</th><th>Subject</th><th>Status</th><th>Attempts</th><th>Last error</th><th>Sent</th></tr></thead><tbody>
        @for (m of d.outbox; track m.id) { <tr><td>{{ m.id }}</td><td>{{ m.toAddress }}</td><td>{{ m.subject }}</td><td>{{ m.status }}</td><td>{{ m.attempts }}</td><td>{{ m.lastError ?? '' }}</td><td>{{ m.sentAt | date: 'd MMM, HH:mm' }}</td></tr> }
      </tbody></table></div>
      <h3>Received by the local mail server</h3>
      <div class="bm-scroll"><table class="bm-t" data-testid="received"><thead><tr><th>Date</th><th>To</th><th>Subject</th><th>Attachments</th><th></th></tr></thead><tbody>
        @for (m of d.received; track m.file) { <tr><td>{{ m.date | date: 'd MMM, HH:mm:ss' }}</td><td>{{ m.to }}</td><td>{{ m.subject }}</td><td>{{ m.attachments.join(', ') }}</td><td><button mat-button (click)="show(m.file)">Show</button></td></tr> }
      </tbody></table></div>
    }
    @if (open(); as m) {
      <section class="bm-msg"><h3>{{ m.subject }}</h3><div class="bm-small">From {{ m.from }} to {{ m.to }}</div><pre>{{ m.text }}</pre>
        @for (a of m.attachments; track a.filename) { <div class="bm-small">Attachment: {{ a.filename }} ({{ a.size }} bytes)</div> }</section>
    }
  `,
  styles: `.bm-t { width: 100%; border-collapse: collapse; background: #fff; font-size: 13px; margin-bottom: 16px; } .bm-t th { text-align: left; color: var(--bm-muted); border-bottom: 1px solid var(--bm-line); padding: 4px 6px; }
    .bm-t td { border-bottom: 1px solid #f0f3f4; padding: 4px 6px; } h3 { color: var(--bm-ink); } .bm-msg { background: #fff; border: 1px solid var(--bm-line); border-radius: 8px; padding: 12px 16px; }
    pre { white-space: pre-wrap; font-family: inherit; } .bm-small { color: var(--bm-muted); font-size: 12.5px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MailOutbox {
  private readonly http = inject(HttpClient);
  protected readonly data = toSignal(this.http.get<{ outbox: OutboxRow[]; received: Received[] }>('/api/admin/mail'));
  protected readonly open = signal<Message | null>(null);

  protected async show(file: string): Promise<void> {
    this.open.set(await firstValueFrom(this.http.get<Message>(`/api/admin/mail/${file}`)));
  }
}
