import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import type { IncomingAccessRequest, ShareCode } from '@cellwarden/shared';
import { combineLatest, filter, map, switchMap } from 'rxjs';
import { Api } from '../../core/api';
import { Auth } from '../../core/auth';
import { OnboardingApi } from '../../core/onboarding-api';
import { IncomingRequest } from '../../core/incoming-request/incoming-request';
import { RequestsApi } from '../../core/requests-api';
import { RequestsNotice } from '../../core/requests-notice';
import { serverErrorOf } from '../../core/api-error';
import { confirmAction } from '../confirm-dialog/confirm-dialog';
import { LoadState, toLoadState } from '../../core/load-state';

/** The Requests tab of a system's Access page: a share code to read out, pending requests, the installer's rights. */
@Component({
  selector: 'cw-system-requests',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, MatProgressSpinnerModule, DatePipe, IncomingRequest],
  template: `
    <section aria-labelledby="share-code-heading">
      <h2 id="share-code-heading">Share code</h2>
      <p>
        A support person on the phone can ask for access with a code you read out. It works once, for 15
        minutes; you still approve or decline the request below.
      </p>
      @if (code(); as c) {
        <p class="code" role="status">
          <span class="cw-visually-hidden">Share code: </span><strong>{{ c.code }}</strong>
          <span class="until">until {{ c.expiresAt | date: 'shortTime' }}</span>
        </p>
      }
      <button mat-stroked-button type="button" (click)="makeCode()">
        {{ code() ? 'Make a new code' : 'Make a share code' }}
      </button>
    </section>

    <section aria-labelledby="system-requests-heading">
      <h2 id="system-requests-heading">Waiting for your answer</h2>
      @switch (pending().status) {
        @case ('loading') {
          <mat-spinner diameter="32" aria-label="Loading access requests" />
        }
        @case ('error') {
          <p class="error" role="alert">{{ $any(pending()).message }}</p>
        }
        @default {
          @for (r of $any(pending()).value; track r.id) {
            <cw-incoming-request [request]="r" (answered)="answered()" />
          } @empty {
            <p class="empty">No requests are waiting.</p>
          }
        }
      }
    </section>

    @if (installerCompanyId() && isOwner()) {
      <section aria-labelledby="installer-heading">
        <h2 id="installer-heading">Installer company</h2>
        <p>
          The company that set up this system can view, configure and commission it and manage its devices.
          End this when they no longer service it; grant them access again later if you need to.
        </p>
        <button mat-stroked-button type="button" (click)="removeInstaller()">
          End the installer's rights
        </button>
      </section>
    }
    @if (error(); as message) {
      <p class="error" role="alert">{{ message }}</p>
    }
  `,
  styles: `
    section {
      margin-bottom: 24px;
    }
    .code {
      display: flex;
      align-items: baseline;
      gap: 12px;
      font: var(--mat-sys-headline-small);
      letter-spacing: 0.12em;
    }
    .until {
      font: var(--mat-sys-body-medium);
      letter-spacing: normal;
      color: var(--mat-sys-on-surface-variant);
    }
    .error {
      color: var(--mat-sys-error);
    }
    .empty {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class SystemRequests {
  private readonly requests = inject(RequestsApi);
  private readonly onboarding = inject(OnboardingApi);
  private readonly notice = inject(RequestsNotice);
  private readonly dialog = inject(MatDialog);
  private readonly auth = inject(Auth);
  private readonly systems = inject(Api);

  /** The system whose requests these are. */
  readonly systemId = input.required<string>();

  private readonly reloads = signal(0);
  protected readonly pending = toSignal(
    combineLatest([toObservable(this.systemId), toObservable(this.reloads)]).pipe(
      switchMap(([id]) => toLoadState(this.requests.incoming(id), 'Access requests could not be loaded.')),
    ),
    { initialValue: { status: 'loading' } as LoadState<IncomingAccessRequest[]> },
  );
  // The system's answer carries its owner and installer company (the access rule's facts).
  private readonly facts = toSignal(
    combineLatest([toObservable(this.systemId), toObservable(this.reloads)]).pipe(
      switchMap(([id]) => this.systems.system(id)),
      map((s) => s as unknown as { ownerId?: string; installerCompanyId?: string | null }),
    ),
    { initialValue: null },
  );
  protected readonly installerCompanyId = computed(() => this.facts()?.installerCompanyId ?? null);
  protected readonly isOwner = computed(
    () => !!this.facts() && this.facts()?.ownerId === this.auth.currentUser()?.id,
  );
  protected readonly code = signal<ShareCode | null>(null);
  protected readonly error = signal<string | null>(null);

  protected makeCode(): void {
    this.error.set(null);
    this.requests.shareCode(this.systemId()).subscribe({
      next: (code) => this.code.set(code),
      error: (error: unknown) => this.error.set(serverErrorOf(error, 'No code could be made.').message),
    });
  }

  protected answered(): void {
    this.notice.refresh();
    this.reloads.update((n) => n + 1);
  }

  protected removeInstaller(): void {
    confirmAction(this.dialog, {
      title: "End the installer's rights?",
      message: 'The installer company no longer sees this system or its alerts.',
      confirmLabel: 'End rights',
    })
      .pipe(
        filter(Boolean),
        switchMap(() => this.onboarding.removeInstaller(this.systemId())),
      )
      .subscribe({
        next: () => this.reloads.update((n) => n + 1),
        error: (error: unknown) =>
          this.error.set(serverErrorOf(error, "The installer's rights could not be ended.").message),
      });
  }
}
