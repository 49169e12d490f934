import { DatePipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  inject,
  input,
  signal,
} from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import type { CommissioningCheck } from '@cellwarden/shared';
import { Subscription, combineLatest, switchMap } from 'rxjs';
import { LoadState, toLoadState } from '../../core/load-state';
import { serverErrorOf } from '../../core/api-error';
import { InstallerApi } from '../installer-api';
import { Uploads } from '../uploads/uploads';
import { CheckForm } from './check-form/check-form';
import { CheckResult } from './check-result/check-result';
import { saveBlob } from '../../core/blob-files';
import { pollCheck } from './poll-check';

/** Route systems/:id/commissioning: start a check, follow it, past checks, the record, and uploads. */
@Component({
  selector: 'cw-commissioning',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatProgressSpinnerModule,
    MatExpansionModule,
    RouterLink,
    DatePipe,
    CheckForm,
    CheckResult,
    Uploads,
  ],
  templateUrl: './commissioning.html',
  styleUrl: './commissioning.scss',
})
export class Commissioning {
  private readonly api = inject(InstallerApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly destroyRef = inject(DestroyRef);

  /** The system id from the route. */
  readonly id = input.required<string>();

  private readonly reloads = signal(0);
  private polling: Subscription | null = null;
  protected readonly current = signal<CommissioningCheck | null>(null);
  protected readonly isRunning = computed(() => this.current()?.status === 'running');
  protected readonly progressPercent = computed(() => {
    const progress = this.current()?.progress;
    if (!progress || progress.secondsNeeded <= 0) return 0;
    return Math.min(100, Math.round((100 * progress.secondsMeasured) / progress.secondsNeeded));
  });
  protected readonly past = toSignal(
    combineLatest([toObservable(this.id), toObservable(this.reloads)]).pipe(
      switchMap(([id]) => toLoadState(this.api.checks(id), 'The past checks could not be loaded.')),
    ),
    { initialValue: { status: 'loading' } as LoadState<CommissioningCheck[]> },
  );
  protected readonly downloading = signal(false);
  protected readonly emailing = signal(false);

  constructor() {
    this.destroyRef.onDestroy(() => this.polling?.unsubscribe());
  }

  protected follow(check: CommissioningCheck): void {
    this.current.set(check);
    this.polling?.unsubscribe();
    if (check.status !== 'running') return this.reload();
    this.polling = pollCheck(() => this.api.check(this.id(), check.id)).subscribe({
      next: (latest) => this.current.set(latest),
      complete: () => this.reload(),
      error: (error: unknown) =>
        this.snackBar.open(
          serverErrorOf(error, 'Lost track of the running check; reload the page.').message,
          'Dismiss',
        ),
    });
  }

  protected downloadRecord(): void {
    this.downloading.set(true);
    this.api.recordPdf(this.id()).subscribe({
      next: (pdf) => {
        this.downloading.set(false);
        saveBlob(pdf, `commissioning-record-${this.id()}.pdf`);
      },
      error: (error: unknown) => {
        this.downloading.set(false);
        this.snackBar.open(serverErrorOf(error, 'The record could not be downloaded.').message, 'Dismiss');
      },
    });
  }

  protected emailRecord(): void {
    this.emailing.set(true);
    this.api.emailRecord(this.id()).subscribe({
      next: () => {
        this.emailing.set(false);
        this.snackBar.open('The commissioning record is on its way to the owner.', 'OK', { duration: 6000 });
      },
      error: (error: unknown) => {
        this.emailing.set(false);
        this.snackBar.open(serverErrorOf(error, 'The record could not be sent.').message, 'Dismiss');
      },
    });
  }

  private reload(): void {
    this.reloads.update((n) => n + 1);
  }
}
