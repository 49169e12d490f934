import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { DateTimePipe } from '../../core/date-time-pipe';
import { flagText } from '../../core/flag-text';
import type { ActiveFlag } from '../live-state';

/** The active flags of a system, critical first, each with its meaning and what to do. */
@Component({
  selector: 'cw-flag-list',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule, DateTimePipe, RouterLink],
  templateUrl: './flag-list.html',
  styleUrl: './flag-list.scss',
})
export class FlagList {
  /** The flags to show. */
  readonly flags = input.required<readonly ActiveFlag[]>();
  /** The system, for the link to its alerts. */
  readonly systemId = input.required<string>();

  protected readonly items = computed(() =>
    [...this.flags()]
      .sort((a, b) => severityRank(b.severity) - severityRank(a.severity) || a.since - b.since)
      .map((flag) => ({ ...flag, text: flagText(flag.kind) })),
  );
}

function severityRank(severity: ActiveFlag['severity']): number {
  return severity === 'critical' ? 1 : 0;
}
