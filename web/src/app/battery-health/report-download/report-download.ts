import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { firstValueFrom } from 'rxjs';
import { saveBlob } from '../../core/blob-files';
import { transferProblem } from '../../core/api-error';
import { BatteryHealthApi, type HealthReportFormat } from '../battery-health-api';
import { dayInputValue, reportPeriod } from './report-period';

type DownloadState =
  | { phase: 'idle' }
  | { phase: 'working'; format: HealthReportFormat }
  | { phase: 'saved'; fileName: string }
  | { phase: 'failed'; message: string };

/** Chooses a period and downloads the battery health report for it as PDF or CSV. */
@Component({
  selector: 'cw-report-download',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  template: `
    <section aria-labelledby="report-title">
      <h2 id="report-title">Health report</h2>
      <p class="note">
        A PDF to hand to a buyer or a warranty desk, or a CSV for a spreadsheet, for the days you choose (your
        calendar days; the report names the system's time zone).
      </p>
      <div class="range">
        <mat-form-field appearance="outline" subscriptSizing="dynamic">
          <mat-label>First day</mat-label>
          <input matInput type="date" [ngModel]="firstDay()" (ngModelChange)="firstDay.set($event)" />
        </mat-form-field>
        <mat-form-field appearance="outline" subscriptSizing="dynamic">
          <mat-label>Last day</mat-label>
          <input matInput type="date" [ngModel]="lastDay()" (ngModelChange)="lastDay.set($event)" />
        </mat-form-field>
      </div>
      @if (period().problem; as problem) {
        <p class="error" role="alert">{{ problem }}</p>
      }
      <div class="actions">
        <button
          mat-flat-button
          type="button"
          [disabled]="busy() || !!period().problem"
          (click)="download('pdf')"
        >
          <mat-icon aria-hidden="true">picture_as_pdf</mat-icon>Download PDF
        </button>
        <button
          mat-stroked-button
          type="button"
          [disabled]="busy() || !!period().problem"
          (click)="download('csv')"
        >
          <mat-icon aria-hidden="true">table_view</mat-icon>Download CSV
        </button>
      </div>
      <p aria-live="polite" class="status">
        @switch (state().phase) {
          @case ('working') {
            Making the report…
          }
          @case ('saved') {
            Saved {{ savedName() }}.
          }
          @case ('failed') {
            <span class="error">{{ failure() }}</span>
          }
        }
      </p>
    </section>
  `,
  styles: `
    .range,
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 12px;
      margin: 8px 0;
    }
    .note,
    .status {
      color: var(--mat-sys-on-surface-variant);
    }
    .error {
      color: var(--mat-sys-error);
    }
  `,
})
export class ReportDownload {
  private readonly api = inject(BatteryHealthApi);
  /** The system the report is about. */
  readonly systemId = input.required<string>();
  /** The period the figures cover (ms), used to prefill the days; the last year when absent. */
  readonly covered = input<{ from: number; to: number } | null>(null);

  protected readonly firstDay = signal('');
  protected readonly lastDay = signal('');
  protected readonly state = signal<DownloadState>({ phase: 'idle' });
  protected readonly busy = computed(() => this.state().phase === 'working');
  protected readonly period = computed(() => reportPeriod(this.firstDay(), this.lastDay()));
  protected readonly savedName = computed(() => {
    const s = this.state();
    return s.phase === 'saved' ? s.fileName : '';
  });
  protected readonly failure = computed(() => {
    const s = this.state();
    return s.phase === 'failed' ? s.message : '';
  });

  constructor() {
    effect(() => this.prefill(this.covered()));
  }

  /** Downloads the report of the chosen days in `format`. */
  protected async download(format: HealthReportFormat): Promise<void> {
    const { from, to } = this.period();
    if (!from || !to) return;
    this.state.set({ phase: 'working', format });
    try {
      const blob = await firstValueFrom(this.api.report(this.systemId(), format, from, to));
      const fileName = `battery-health-${this.firstDay()}-to-${this.lastDay()}.${format}`;
      saveBlob(blob, fileName);
      this.state.set({ phase: 'saved', fileName });
    } catch (error) {
      this.state.set({ phase: 'failed', message: (await transferProblem(error)).message });
    }
  }

  private prefill(covered: { from: number; to: number } | null): void {
    const to = covered?.to ?? Date.now();
    const from = covered?.from ?? to - 365 * 86_400_000;
    this.firstDay.set(dayInputValue(from));
    this.lastDay.set(dayInputValue(to - 1));
  }
}
