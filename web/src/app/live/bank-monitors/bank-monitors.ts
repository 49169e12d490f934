import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { MonitorLatest } from '@cellwarden/shared';
import { DateTimePipe } from '../../core/date-time-pipe';
import { TemperaturePipe } from '../../core/temperature-pipe';

/**
 * Every monitor of a bank that carries more than one, each under its own label: the figures above the list follow
 * the lead monitor, so the others are shown here side by side instead of taking turns in the headline.
 */
@Component({
  selector: 'cw-bank-monitors',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DecimalPipe, DateTimePipe, TemperaturePipe],
  templateUrl: './bank-monitors.html',
  styleUrl: './bank-monitors.scss',
})
export class BankMonitors {
  /** The bank's monitors, lead first. */
  readonly monitors = input.required<readonly MonitorLatest[]>();

  protected readonly lead = computed(() => this.monitors().find((m) => m.lead) ?? null);
}
