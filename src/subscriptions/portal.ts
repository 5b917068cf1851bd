import { DatePipe, DecimalPipe, UpperCasePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import type { MailPreference } from '../../api/users/user.schemas';
import { AuthStore } from '../core/auth/auth-store';
import { firstValueFrom } from 'rxjs';
import type { SubscriptionView } from '../../api/subscriptions/subscription.schemas';
import { AdvisoryList } from '../advisories/advisory-list';
import { Notifier } from '../core/errors/notifier';
import { SubscriptionApi } from './subscription-api';

/** The licensee's portal: their regions and subscription, invoices, and their advisories. */
@Component({
  selector: 'bm-portal',
  imports: [FormsModule, DatePipe, DecimalPipe, UpperCasePipe, MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatSelectModule, MatIconModule, MatRadioModule, AdvisoryList],
  templateUrl: './portal.html',
  styleUrl: './portal.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Portal {
  readonly checkout = input<string>();
  private readonly api = inject(SubscriptionApi);
  private readonly notifier = inject(Notifier);
  protected readonly subs = signal<SubscriptionView[]>([]);
  protected readonly plans = toSignal(this.api.plans(), { initialValue: [] });
  protected readonly regions = computed(() => [...new Map(this.plans().map((p) => [p.regionId, p.regionName])).entries()]);
  protected regionId: number | null = null;
  protected plan: 'monthly' | 'yearly' = 'yearly';
  protected readonly busy = signal(false);
  protected readonly mailPreference = signal<MailPreference>(inject(AuthStore).user()?.mailPreference ?? 'every');

  constructor() {
    // back from the payment page without paying (a declined card, or "Cancel"): the unfinished checkout goes
    queueMicrotask(() => {
      if (this.checkout() === 'cancelled') void firstValueFrom(this.api.abandonPending()).then(() => this.reload(), () => undefined);
    });
    void this.reload();
    // the webhook may land a moment after Stripe sends the person back here
    setTimeout(() => void this.reload(), 1500);
  }

  protected price(plan: 'monthly' | 'yearly') {
    return this.plans().find((p) => p.plan === plan);
  }

  protected async reload(): Promise<void> {
    this.subs.set(await firstValueFrom(this.api.mine()));
  }

  protected async subscribe(): Promise<void> {
    if (!this.regionId) return;
    this.busy.set(true);
    try {
      const { url } = await firstValueFrom(this.api.checkout(this.regionId, this.plan));
      window.location.assign(url);
    } catch (err) {
      this.notifier.error(err instanceof Error ? err.message : 'Checkout could not start.');
      this.busy.set(false);
    }
  }

  protected async setMailPreference(choice: MailPreference): Promise<void> {
    const was = this.mailPreference();
    this.mailPreference.set(choice);
    try {
      await firstValueFrom(this.api.setMailPreference(choice));
      this.notifier.info(choice === 'every' ? 'You will get every advisory by e-mail.' : choice === 'corrections' ? 'You will get corrections only by e-mail.' : 'You will get a weekly digest.');
    } catch (err) {
      this.mailPreference.set(was);
      this.notifier.error(err instanceof Error ? err.message : 'Could not save your choice.');
    }
  }

  protected async cancel(s: SubscriptionView): Promise<void> {
    try {
      await firstValueFrom(this.api.cancel(s.id));
      this.notifier.info('Cancellation requested: access continues to the end of the paid period.');
      setTimeout(() => void this.reload(), 800);
    } catch (err) {
      this.notifier.error(err instanceof Error ? err.message : 'Could not cancel.');
    }
  }
}
