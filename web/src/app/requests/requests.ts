import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatTableModule } from '@angular/material/table';
import { Router } from '@angular/router';
import type {
  IncomingAccessRequest,
  NewAccessRequest,
  OutgoingAccessRequest,
  SystemHandover,
} from '@cellwarden/shared';
import { switchMap } from 'rxjs';
import { LoadState, toLoadState } from '../core/load-state';
import { Auth } from '../core/auth';
import { OnboardingApi } from '../core/onboarding-api';
import { serverErrorOf, showServerError } from '../core/api-error';
import { IncomingRequest } from '../core/incoming-request/incoming-request';
import { RequestsApi } from '../core/requests-api';
import { RequestsNotice } from '../core/requests-notice';

type AskBy = 'owner-and-name' | 'share-code';

/** Route requests: systems set up for me, access requests on my systems, and (support staff) asking for access. */
@Component({
  selector: 'cw-requests',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule,
    DatePipe,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressSpinnerModule,
    MatTableModule,
    IncomingRequest,
  ],
  templateUrl: './requests.html',
  styleUrls: ['../access/access-tables.scss', './requests.scss'],
})
export class Requests {
  private readonly requests = inject(RequestsApi);
  private readonly onboarding = inject(OnboardingApi);
  private readonly notice = inject(RequestsNotice);
  private readonly router = inject(Router);
  private readonly auth = inject(Auth);
  protected readonly isSupport = computed(() => this.auth.hasAnyRole(['support']));

  private readonly reloads = signal(0);
  protected readonly handovers = toSignal(
    toObservable(this.reloads).pipe(
      switchMap(() =>
        toLoadState(this.onboarding.handovers(), 'Systems set up for you could not be loaded.'),
      ),
    ),
    { initialValue: { status: 'loading' } as LoadState<SystemHandover[]> },
  );
  protected readonly incoming = toSignal(
    toObservable(this.reloads).pipe(
      switchMap(() => toLoadState(this.requests.incoming(), 'Access requests could not be loaded.')),
    ),
    { initialValue: { status: 'loading' } as LoadState<IncomingAccessRequest[]> },
  );
  protected readonly outgoing = toSignal(
    toObservable(this.reloads).pipe(
      switchMap(() => toLoadState(this.requests.outgoing(), 'Your requests could not be loaded.')),
    ),
    { initialValue: { status: 'loading' } as LoadState<OutgoingAccessRequest[]> },
  );
  protected readonly outgoingColumns = ['asked', 'sent', 'state'];

  protected readonly form = inject(FormBuilder).nonNullable.group({
    by: ['owner-and-name' as AskBy],
    ownerEmail: ['', [Validators.required, Validators.email]],
    systemName: ['', [Validators.required, Validators.maxLength(120)]],
    shareCode: [''],
    note: ['', Validators.maxLength(300)],
  });
  protected readonly by = toSignal(this.form.controls.by.valueChanges, {
    initialValue: 'owner-and-name' as AskBy,
  });
  protected readonly sending = signal(false);
  protected readonly sent = signal<string | null>(null);
  protected readonly serverError = signal<string | null>(null);
  protected readonly accepting = signal<string | null>(null);

  constructor() {
    toObservable(this.by).subscribe((by) => this.requireFieldsFor(by));
  }

  protected askForAccess(): void {
    this.serverError.set(null);
    this.sent.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const value = this.form.getRawValue();
    const note = value.note.trim() || undefined;
    const request: NewAccessRequest =
      value.by === 'share-code'
        ? { shareCode: value.shareCode.trim(), note }
        : { ownerEmail: value.ownerEmail.trim(), systemName: value.systemName.trim(), note };
    this.sending.set(true);
    this.requests.ask(request).subscribe({
      next: () => {
        this.sending.set(false);
        this.form.reset({ by: value.by });
        this.sent.set(
          value.by === 'share-code'
            ? 'Request sent to the owner who gave you the code. The system appears under Systems once they approve.'
            : 'Request sent. If that owner has a system by that name, they are asked; it appears under Systems once they approve.',
        );
        this.reloads.update((n) => n + 1);
      },
      error: (error: unknown) => {
        this.sending.set(false);
        this.serverError.set(
          showServerError(this.form, serverErrorOf(error, 'The request could not be sent.')),
        );
      },
    });
  }

  protected acceptHandover(handover: SystemHandover): void {
    this.accepting.set(handover.id);
    this.onboarding.acceptHandover(handover.id).subscribe({
      next: ({ systemId }) => {
        this.notice.refresh();
        void this.router.navigate(['/systems', systemId]);
      },
      error: () => {
        this.accepting.set(null);
        this.reloads.update((n) => n + 1);
      },
    });
  }

  protected answered(): void {
    this.notice.refresh();
    this.reloads.update((n) => n + 1);
  }

  protected stateWords(state: OutgoingAccessRequest['state']): string {
    return {
      pending: 'Waiting for the owner',
      approved: 'Approved',
      declined: 'Declined',
      expired: 'Lapsed',
    }[state];
  }

  private requireFieldsFor(by: AskBy): void {
    const { ownerEmail, systemName, shareCode } = this.form.controls;
    ownerEmail.setValidators(by === 'owner-and-name' ? [Validators.required, Validators.email] : null);
    systemName.setValidators(
      by === 'owner-and-name' ? [Validators.required, Validators.maxLength(120)] : null,
    );
    shareCode.setValidators(
      by === 'share-code' ? [Validators.required, Validators.pattern(/^[\s\w-]{8,12}$/)] : null,
    );
    for (const control of [ownerEmail, systemName, shareCode]) control.updateValueAndValidity();
  }
}
