import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatTableModule } from '@angular/material/table';
import { firstValueFrom } from 'rxjs';
import type { Role, UserView } from '../../api/users/user.schemas';
import { AuthStore } from '../core/auth/auth-store';
import { ApiError } from '../core/errors/api-error';
import { Notifier } from '../core/errors/notifier';
import { RegionApi } from '../regions/region-api';
import { BoardRules } from './board-rules';
import { UserApi } from './user-api';

@Component({
  selector: 'bm-user-admin',
  imports: [ReactiveFormsModule, MatTableModule, MatSelectModule, MatFormFieldModule, MatInputModule, MatButtonModule,
    MatIconModule, MatSlideToggleModule, MatCardModule, MatCheckboxModule, BoardRules],
  templateUrl: './user-admin.html',
  styleUrl: './user-admin.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UserAdmin {
  private readonly api = inject(UserApi);
  private readonly notifier = inject(Notifier);
  protected readonly me = inject(AuthStore).user;
  protected readonly roles: readonly Role[] = ['admin', 'assessor', 'board', 'licensee'];
  protected readonly columns = ['name', 'email', 'role', 'region', 'chair', 'active', 'password'];
  protected readonly resetFor = signal<UserView | null>(null);
  protected readonly newPassword = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.minLength(10)] });
  protected readonly users = signal<UserView[]>([]);
  protected readonly regions = toSignal(inject(RegionApi).list(), { initialValue: [] });
  protected readonly regionName = computed(() => new Map(this.regions().map((r) => [r.id, r.name])));
  protected readonly serverErrors = signal<Record<string, string[]>>({});

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.minLength(2)]],
    email: ['', [Validators.required, Validators.email]],
    role: ['assessor' as Role, Validators.required],
    organisation: [''],
    regionId: [null as number | null],
    password: ['', [Validators.required, Validators.minLength(10)]],
  });

  constructor() {
    void this.reload();
  }

  protected async reload(): Promise<void> {
    this.users.set(await firstValueFrom(this.api.list()));
  }

  protected async create(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const v = this.form.getRawValue();
    try {
      const user = await firstValueFrom(this.api.create({ ...v, organisation: v.organisation || null }));
      this.serverErrors.set({});
      this.form.reset();
      this.notifier.info(`Account created for ${user.name}.`);
      await this.reload();
    } catch (err) {
      if (err instanceof ApiError) this.serverErrors.set(err.fields);
      this.notifier.error(err instanceof Error ? err.message : 'Could not create the account.');
    }
  }

  protected async resetPassword(user: UserView): Promise<void> {
    this.newPassword.markAsTouched();
    if (this.newPassword.invalid) return;
    try {
      await firstValueFrom(this.api.resetPassword(user.id, this.newPassword.value));
      this.notifier.info(`New password set for ${user.name}.`);
      this.newPassword.reset();
      this.resetFor.set(null);
    } catch (err) {
      this.notifier.error(err instanceof Error ? err.message : 'Could not set the password.');
    }
  }

  protected async change(user: UserView, patch: { role?: Role; active?: boolean; regionId?: number | null; boardChair?: boolean }): Promise<void> {
    try {
      await firstValueFrom(this.api.update(user.id, patch));
      this.notifier.info(`Saved changes to ${user.name}.`);
    } catch (err) {
      this.notifier.error(err instanceof Error ? err.message : 'Could not save the change.');
    }
    await this.reload();
  }
}
