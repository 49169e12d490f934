import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatIconModule } from '@angular/material/icon';
import type { RecordCheckChoice } from '@cellwarden/shared';
import { catchError, map, of, switchMap } from 'rxjs';
import { apiProblem } from '../../core/api-error';
import { saveBlob } from '../../core/blob-files';
import { InstallRegisterApi } from '../install-register-api';

const LEFT_OUT: Record<NonNullable<RecordCheckChoice['leftOutBecause']>, string> = {
  superseded: 'a later check of this source replaces it',
  stale: 'made against a rating this source no longer has',
  unfinished: 'no verdict (running or abandoned)',
};

/** The installer picks the checks the commissioning record carries, then downloads it. */
@Component({
  selector: 'cw-record-picker',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe, MatButtonModule, MatCheckboxModule, MatIconModule],
  template: `
    @if (choices(); as list) {
      @if (list === 'error') {
        <p role="alert" class="problem">The checks could not be loaded. Reload the page to try again.</p>
      } @else {
        <fieldset>
          <legend>Checks in the record</legend>
          @for (choice of list; track choice.checkId) {
            <div class="choice">
              <mat-checkbox
                [checked]="isPicked(choice)"
                [disabled]="choice.leftOutBecause === 'unfinished'"
                (change)="toggle(choice.checkId, $event.checked)"
                >{{ choice.sourceId }}, {{ choice.ratedCurrentA }} A — {{ choice.status }},
                {{ choice.startedAt | date: 'medium' }}</mat-checkbox
              >
              @if (choice.leftOutBecause) {
                <span class="why">Left out by default: {{ leftOut(choice) }}</span>
              }
            </div>
          } @empty {
            <p class="note">No commissioning checks yet: the record will say so.</p>
          }
        </fieldset>
      }
    }
    <button mat-flat-button type="button" (click)="download()" [disabled]="downloading()">
      <mat-icon aria-hidden="true">picture_as_pdf</mat-icon> Download the record (PDF)
    </button>
    @if (problem(); as message) {
      <p role="alert" class="problem">{{ message }}</p>
    }
  `,
  styles: `
    fieldset {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
      margin: 0 0 12px;
    }
    .choice {
      display: flex;
      flex-direction: column;
    }
    .why,
    .note {
      color: var(--mat-sys-on-surface-variant);
      margin-left: 40px;
    }
    .problem {
      color: var(--mat-sys-error);
    }
  `,
})
export class RecordPicker {
  private readonly api = inject(InstallRegisterApi);

  /** The system whose record is made. */
  readonly systemId = input.required<string>();

  protected readonly choices = toSignal(
    toObservable(this.systemId).pipe(
      switchMap((id) =>
        this.api.recordChoices(id).pipe(
          map((list) => list as RecordCheckChoice[] | 'error'),
          catchError(() => of('error' as const)),
        ),
      ),
    ),
    { initialValue: null },
  );
  /** The person's changes to the default choice, by check id. */
  private readonly overrides = signal<Record<string, boolean>>({});
  protected readonly picked = computed(() => {
    const list = this.choices();
    if (!Array.isArray(list)) return [];
    const overrides = this.overrides();
    return list.filter((c) => overrides[c.checkId] ?? c.byDefault).map((c) => c.checkId);
  });
  protected readonly downloading = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected isPicked(choice: RecordCheckChoice): boolean {
    return this.overrides()[choice.checkId] ?? choice.byDefault;
  }

  protected toggle(checkId: string, on: boolean): void {
    this.overrides.update((o) => ({ ...o, [checkId]: on }));
  }

  protected leftOut(choice: RecordCheckChoice): string {
    return choice.leftOutBecause ? LEFT_OUT[choice.leftOutBecause] : '';
  }

  protected download(): void {
    this.downloading.set(true);
    this.problem.set(null);
    this.api.recordPdf(this.systemId(), this.picked()).subscribe({
      next: (pdf) => {
        this.downloading.set(false);
        saveBlob(pdf, `commissioning-record-${this.systemId()}.pdf`);
      },
      error: (error: unknown) => {
        this.downloading.set(false);
        this.problem.set(apiProblem(error).message);
      },
    });
  }
}
