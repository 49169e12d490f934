import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, FormGroupDirective, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { COMPANY_ROLES, type CompanyMember, type Invitation, type Role } from '@cellwarden/shared';
import { switchMap } from 'rxjs';
import { LoadState, toLoadState } from '../core/load-state';
import { Auth } from '../core/auth';
import { roleLabel, roleReach } from '../core/role-label';
import { serverErrorOf, showServerError } from '../core/api-error';
import { TeamApi } from './team-api';

/** Admin screen: the company's members and invitations, the invite form, removal and withdrawal. */
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
  styleUrls: ['../access/access-tables.scss', './team.scss'],
})
export class Team {
  private readonly api = inject(TeamApi);
  private readonly auth = inject(Auth);

  private readonly memberReloads = signal(0);
  private readonly invitationReloads = signal(0);
  protected readonly companyRoles = COMPANY_ROLES;
  protected readonly memberColumns = ['name', 'email', 'roles', 'actions'];
  protected readonly invitationColumns = ['email', 'roles', 'status', 'actions'];
  protected readonly myId = computed(() => this.auth.currentUser()?.id ?? null);
  protected readonly members = toSignal(
    toObservable(this.memberReloads).pipe(
      switchMap(() => toLoadState(this.api.members(), 'The members could not be loaded.')),
    ),
    { initialValue: { status: 'loading' } as LoadState<CompanyMember[]> },
  );
  protected readonly invitations = toSignal(
    toObservable(this.invitationReloads).pipe(
      switchMap(() => toLoadState(this.api.invitations(), 'The invitations could not be loaded.')),
    ),
    { initialValue: { status: 'loading' } as LoadState<Invitation[]> },
  );
  // One role per invitation, chosen on purpose: no default, so nobody becomes an installer by accident.
  protected readonly form = inject(FormBuilder).nonNullable.group({
    email: ['', [Validators.required, Validators.email]],
    role: ['' as Role | '', Validators.required],
  });
  private readonly chosenRole = toSignal(this.form.controls.role.valueChanges, {
    initialValue: '' as Role | '',
  });
  protected readonly roleHint = computed(() => {
    const role = this.chosenRole();
    return role ? roleReach(role) : 'Pick the one role this person needs.';
  });
  protected readonly submitting = signal(false);
  protected readonly serverError = signal<string | null>(null);
  protected readonly sentTo = signal<string | null>(null);
  /** The member whose removal waits for a second click. */
  protected readonly confirmingRemoval = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);

  protected rolesText(roles: Role[]): string {
    return roles.map(roleLabel).join(', ');
  }

  protected invitationStatus(invitation: Invitation): string {
    if (invitation.acceptedAt !== null) return 'Accepted';
    return invitation.expiresAt <= Date.now() ? 'Ended' : 'Pending';
  }

  protected isOpen(invitation: Invitation): boolean {
    return invitation.acceptedAt === null && invitation.expiresAt > Date.now();
  }

  protected roleName(role: Role): string {
    return roleLabel(role);
  }

  protected invite(formDirective: FormGroupDirective): void {
    this.serverError.set(null);
    this.sentTo.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { email, role } = this.form.getRawValue();
    this.submitting.set(true);
    this.api.invite({ email: email.trim(), roles: [role as Role] }).subscribe({
      next: (invitation) => {
        this.submitting.set(false);
        this.sentTo.set(invitation.email);
        // Resetting through the directive clears "submitted" too, so no "required" error follows success.
        formDirective.resetForm({ email: '', role: '' });
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

  protected removeMember(member: CompanyMember): void {
    if (this.confirmingRemoval() !== member.id) return this.confirmingRemoval.set(member.id);
    this.confirmingRemoval.set(null);
    this.api.removeMember(member.id).subscribe({
      next: () => {
        this.notice.set(`${member.displayName} was removed; their sign-ins have ended.`);
        this.memberReloads.update((n) => n + 1);
      },
      error: (error: unknown) =>
        this.notice.set(serverErrorOf(error, `${member.displayName} could not be removed.`).message),
    });
  }

  protected withdraw(invitation: Invitation): void {
    this.api.withdrawInvitation(invitation.id).subscribe({
      next: () => {
        this.notice.set(`The invitation to ${invitation.email} was withdrawn; its link no longer works.`);
        this.invitationReloads.update((n) => n + 1);
      },
      error: (error: unknown) =>
        this.notice.set(serverErrorOf(error, 'The invitation could not be withdrawn.').message),
    });
  }
}
