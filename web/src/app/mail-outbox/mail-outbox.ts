import { DatePipe } from '@angular/common';
import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { catchError, map, of, startWith, switchMap } from 'rxjs';
import { CapturedMail, MailOutboxApi } from './mail-outbox-api';

type OutboxState =
  | { status: 'loading' }
  | { status: 'off' }
  | { status: 'error' }
  | { status: 'loaded'; messages: CapturedMail[] };

/** Admin page listing e-mail the local SMTP catcher kept (invitations, resets, records) during development. */
@Component({
  selector: 'cw-mail-outbox',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatExpansionModule, MatButtonModule, MatIconModule, MatProgressSpinnerModule, DatePipe],
  templateUrl: './mail-outbox.html',
  styleUrl: './mail-outbox.scss',
})
export class MailOutbox {
  private readonly api = inject(MailOutboxApi);

  private readonly reloads = signal(0);
  protected readonly state = toSignal(
    toObservable(this.reloads).pipe(
      switchMap(() =>
        this.api.messages().pipe(
          map((messages): OutboxState => ({ status: 'loaded', messages })),
          // 404 means the server runs without its catcher, which is the normal production case.
          catchError((error: unknown) =>
            of<OutboxState>(
              error instanceof HttpErrorResponse && error.status === 404
                ? { status: 'off' }
                : { status: 'error' },
            ),
          ),
          startWith<OutboxState>({ status: 'loading' }),
        ),
      ),
    ),
    { initialValue: { status: 'loading' } as OutboxState },
  );
  protected readonly messages = computed(() => {
    const state = this.state();
    return state.status === 'loaded' ? [...state.messages].sort((a, b) => b.receivedAt - a.receivedAt) : [];
  });

  protected reload(): void {
    this.reloads.update((n) => n + 1);
  }
}
