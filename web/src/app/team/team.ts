import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import type { CompanyMember, Invitation, Role } from '@cellwarden/shared';
import { switchMap } from 'rxjs';
import { LoadState, toLoadState } from '../access/load-state';
import { ALL_ROLES, roleLabel } from '../invitation/role-label';
import { serverErrorOf, showServerError } from '../sign-in/server-error';
import { TeamApi } from './team-api';

/** Admin screen: the company's members and invitations, and the invite form. */
@Component({
  selector: 'cw-team',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule,
    MatTableModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatProgressSpinnerModule,
    DatePipe,
  ],
  templateUrl: './team.html',
  styleUrl: '../access/access-tables.scss',
})
export class Team {
  private readonly api = inject(TeamApi);

  private readonly invitationReloads = signal(0);
  protected readonly allRoles = ALL_ROLES;
  protected readonly memberColumns = ['name', 'email', 'roles'];
  protected readonly invitationColumns = ['email', 'roles', 'status'];
  protected readonly members = toSignal(toLoadState(this.api.members(), 'The members could not be loaded.'), {
    initialValue: { status: 'loading' } as LoadState<CompanyMember[]>,
  });
  protected readonly invitations = toSignal(
    toObservable(this.invitationReloads).pipe(
      switchMap(() => toLoadState(this.api.invitations(), 'The invitations could not be loaded.')),
    ),
    { initialValue: { status: 'loading' } as LoadState<Invitation[]> },
  );
  protected readonly form = inject(FormBuilder).nonNullable.group({
    email: ['', [Validators.required, Validators.email]],
    roles: [['installer'] as Role[], Validators.required],
  });
  protected readonly submitting = signal(false);
  protected readonly serverError = signal<string | null>(null);
  protected readonly sentTo = signal<string | null>(null);

  protected rolesText(roles: Role[]): string {
    return roles.map(roleLabel).join(', ');
  }

  protected invitationStatus(invitation: Invitation): string {
    if (invitation.acceptedAt !== null) return 'Accepted';
    return invitation.expiresAt <= Date.now() ? 'Expired' : 'Pending';
  }

  protected roleName(role: Role): string {
    return roleLabel(role);
  }

  protected invite(): void {
    this.serverError.set(null);
    this.sentTo.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { email, roles } = this.form.getRawValue();
    this.submitting.set(true);
    this.api.invite({ email: email.trim(), roles }).subscribe({
      next: (invitation) => {
        this.submitting.set(false);
        this.sentTo.set(invitation.email);
        this.form.reset();
        this.invitationReloads.update((n) => n + 1);
      },
      error: (error: unknown) => {
        this.submitting.set(false);
        this.serverError.set(
          showServerError(this.form, serverErrorOf(error, 'The invitation could not be sent.')),
        );
      },
    });
  }
}
