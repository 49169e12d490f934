import { DatePipe } from '@angular/common';
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
  | { status: 'loaded'; address: string; messages: CapturedMail[] };

/** The local SMTP catcher's copy of the signed-in person's own mail (invitations, resets, alerts, records). */
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
        this.api.ownMail().pipe(
          // Without the catcher (the normal production case) mail goes out for real and nothing is kept.
          map((own): OutboxState =>
            own.catcher
              ? { status: 'loaded', address: own.address, messages: own.messages }
              : { status: 'off' },
          ),
          catchError(() => of<OutboxState>({ status: 'error' })),
          startWith<OutboxState>({ status: 'loading' }),
        ),
      ),
    ),
    { initialValue: { status: 'loading' } as OutboxState },
  );
  protected readonly address = computed(() => {
    const state = this.state();
    return state.status === 'loaded' ? state.address : '';
  });
  protected readonly messages = computed(() => {
    const state = this.state();
    return state.status === 'loaded' ? [...state.messages].sort((a, b) => b.receivedAt - a.receivedAt) : [];
  });

  protected reload(): void {
    this.reloads.update((n) => n + 1);
  }
}
