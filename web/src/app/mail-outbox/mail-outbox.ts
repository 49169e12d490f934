import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { switchMap } from 'rxjs';
import { LoadState, loadError, loadedOr, toLoadState } from '../core/load-state';
import { MailOutboxApi, OwnCapturedMail } from './mail-outbox-api';

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
        toLoadState(
          this.api.ownMail(),
          () => 'Your captured mail could not be loaded. Check the connection and reload.',
        ),
      ),
    ),
    { initialValue: { status: 'loading' } as LoadState<OwnCapturedMail> },
  );
  /** What the page shows; without the catcher (the normal production case) mail goes out for real and nothing is kept. */
  protected readonly view = computed(() => {
    const state = this.state();
    return state.status === 'loaded' && !state.value.catcher ? 'off' : state.status;
  });
  protected readonly problem = computed(() => loadError(this.state()));
  private readonly ownMail = computed(() => {
    const own = loadedOr(this.state(), null);
    return own?.catcher ? own : null;
  });
  protected readonly address = computed(() => this.ownMail()?.address ?? '');
  protected readonly messages = computed(() =>
    [...(this.ownMail()?.messages ?? [])].sort((a, b) => b.receivedAt - a.receivedAt),
  );

  protected reload(): void {
    this.reloads.update((n) => n + 1);
  }
}
