import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import type { GrantAccess, IncomingAccessRequest } from '@cellwarden/shared';
import { Observable } from 'rxjs';
import { EXPIRY_QUICK_PICKS } from '../grant-expiry';
import { serverErrorOf } from '../api-error';
import { RequestsApi } from '../requests-api';

const DAY_MS = 86_400_000;

/** One pending access request with its answer: scope and end preset, so approving is one click. */
@Component({
  selector: 'cw-incoming-request',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [FormsModule, MatButtonModule, MatButtonToggleModule, DatePipe],
  template: `
    @let r = request();
    <article class="request" [attr.aria-labelledby]="'request-' + r.id">
      <h3 [id]="'request-' + r.id">
        {{ r.requester.displayName }}
        @if (r.requester.companyName) {
          ({{ r.requester.companyName }})
        }
        asks to see {{ r.systemName }}
      </h3>
      <p class="meta">
        {{ r.requester.email }} ·
        {{ r.via === 'share-code' ? 'with your share code' : 'by your e-mail and the system name' }} · lapses
        {{ r.expiresAt | date: 'medium' }}
      </p>
      @if (r.note) {
        <p class="note">“{{ r.note }}”</p>
      }
      <div class="choices">
        <mat-button-toggle-group [(ngModel)]="access" [attr.aria-label]="'Rights for ' + r.requester.email">
          <mat-button-toggle value="view">View</mat-button-toggle>
          <mat-button-toggle value="configure">View and configure</mat-button-toggle>
        </mat-button-toggle-group>
        <mat-button-toggle-group
          [(ngModel)]="days"
          [attr.aria-label]="'Access ends after, for ' + r.requester.email"
        >
          @for (pick of picks; track pick.days) {
            <mat-button-toggle [value]="pick.days">{{ pick.label }}</mat-button-toggle>
          }
        </mat-button-toggle-group>
      </div>
      <div class="actions">
        <button
          mat-flat-button
          type="button"
          [disabled]="busy()"
          (click)="approve()"
          [attr.aria-label]="'Approve ' + r.requester.email + ' for ' + r.systemName"
        >
          Approve
        </button>
        <button
          mat-stroked-button
          type="button"
          [disabled]="busy()"
          (click)="decline()"
          [attr.aria-label]="'Decline ' + r.requester.email + ' for ' + r.systemName"
        >
          Decline
        </button>
      </div>
      @if (error(); as message) {
        <p class="error" role="alert">{{ message }}</p>
      }
    </article>
  `,
  styles: `
    .request {
      padding: 12px 16px;
      margin-bottom: 12px;
      border-radius: 12px;
      border: 1px solid var(--mat-sys-outline-variant);
    }
    h3 {
      margin: 0 0 4px;
      font: var(--mat-sys-title-medium);
    }
    .meta {
      margin: 0 0 8px;
      color: var(--mat-sys-on-surface-variant);
      overflow-wrap: anywhere;
    }
    .choices,
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
      margin-bottom: 8px;
    }
    .error {
      color: var(--mat-sys-error);
    }
  `,
})
export class IncomingRequest {
  private readonly api = inject(RequestsApi);

  /** The request to answer. */
  readonly request = input.required<IncomingAccessRequest>();
  /** Emits once the owner answered (approved or declined). */
  readonly answered = output<'approved' | 'declined'>();

  protected readonly picks = EXPIRY_QUICK_PICKS;
  protected access: GrantAccess = 'view';
  protected days: number = 7;
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);

  protected approve(): void {
    const expiresAt = new Date(Date.now() + this.days * DAY_MS).toISOString();
    this.answer(this.api.approve(this.request().id, { access: this.access, expiresAt }), 'approved');
  }

  protected decline(): void {
    this.answer(this.api.decline(this.request().id), 'declined');
  }

  private answer(call: Observable<unknown>, outcome: 'approved' | 'declined'): void {
    this.busy.set(true);
    this.error.set(null);
    call.subscribe({
      next: () => {
        this.busy.set(false);
        this.answered.emit(outcome);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.error.set(serverErrorOf(error, 'The answer could not be saved. Try again.').message);
      },
    });
  }
}
