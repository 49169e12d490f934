import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { CommissioningCheck } from '@cellwarden/shared';

const STATUS_TEXT: Record<CommissioningCheck['status'], string> = {
  running: 'Running',
  passed: 'Passed',
  failed: 'Failed',
  abandoned: 'Abandoned',
};

/** A finished check's figures and the reasons for its verdict. */
@Component({
  selector: 'cw-check-result',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `
    <p class="status" [class]="check().status">
      <mat-icon aria-hidden="true">{{ icon() }}</mat-icon> {{ statusText() }}: {{ check().sourceId }} rated
      {{ check().ratedCurrentA }} A (±{{ check().tolerancePercent }} %)
    </p>
    @if (check().result; as result) {
      <dl class="figures">
        <div>
          <dt>Mean current</dt>
          <dd>{{ amps(result.meanCurrentA) }}</dd>
        </div>
        <div>
          <dt>Lowest / highest</dt>
          <dd>{{ amps(result.minCurrentA) }} / {{ amps(result.maxCurrentA) }}</dd>
        </div>
        <div>
          <dt>Ripple, peak to peak</dt>
          <dd>{{ amps(result.ripplePeakToPeakA) }}</dd>
        </div>
        <div>
          <dt>Battery voltage reached</dt>
          <dd>{{ volts(result.batteryVoltageReached) }}</dd>
        </div>
        <div>
          <dt>Cable drop</dt>
          <dd>{{ volts(result.cableDropV) }}</dd>
        </div>
      </dl>
      @if (result.reasons.length) {
        <ul class="reasons" aria-label="Reasons">
          @for (reason of result.reasons; track reason) {
            <li>{{ reason }}</li>
          }
        </ul>
      }
    }
  `,
  styleUrl: './check-result.scss',
})
export class CheckResult {
  /** The check to show. */
  readonly check = input.required<CommissioningCheck>();

  protected readonly statusText = computed(() => STATUS_TEXT[this.check().status]);
  protected readonly icon = computed(() =>
    this.check().status === 'passed'
      ? 'check_circle'
      : this.check().status === 'running'
        ? 'pending'
        : 'cancel',
  );

  protected amps(value: number | null): string {
    return value === null ? '—' : `${value.toFixed(1)} A`;
  }

  protected volts(value: number | null): string {
    return value === null ? '—' : `${value.toFixed(2)} V`;
  }
}
