import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { COLUMN_HEIGHT, chargeBand, levelY } from './charge-geometry';

const BAND_WORDS = { critical: 'very low', low: 'low', fair: 'fair', good: 'good' } as const;

/** Cellwarden's state-of-charge figure: a column of five stacked cells filling from the bottom. */
@Component({
  selector: 'cw-charge-column',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DecimalPipe],
  templateUrl: './charge-column.html',
  styleUrl: './charge-column.scss',
  host: { '[class]': "'band-' + (band() ?? 'none')", '[class.stale]': 'stale()' },
})
export class ChargeColumn {
  /** State of charge, %, or null when unknown. */
  readonly stateOfCharge = input<number | null>(null);
  /** Whether it was reported by the monitor or estimated by Cellwarden. */
  readonly source = input<'reported' | 'estimated' | null>(null);
  /** The projected state of charge by morning, %, drawn as a dashed mark. */
  readonly projected = input<number | null>(null);
  /** The value is old; draw it hatched and say so. */
  readonly stale = input(false);

  protected readonly height = COLUMN_HEIGHT;
  protected readonly cells = [0, 1, 2, 3, 4].map((i) => (i * COLUMN_HEIGHT) / 5);
  protected readonly band = computed(() => {
    const soc = this.stateOfCharge();
    return soc == null ? null : chargeBand(soc);
  });
  protected readonly fillY = computed(() => levelY(this.stateOfCharge() ?? 0));
  protected readonly projectedY = computed(() => {
    const projected = this.projected();
    return projected == null ? null : levelY(projected);
  });
  protected readonly label = computed(() => {
    const soc = this.stateOfCharge();
    if (soc == null) return 'State of charge unknown';
    const parts = [`State of charge ${Math.round(soc)} %, ${BAND_WORDS[chargeBand(soc)]}`];
    if (this.source() === 'estimated') parts.push('estimated by Cellwarden');
    const projected = this.projected();
    if (projected != null) parts.push(`about ${Math.round(projected)} % by morning`);
    if (this.stale()) parts.push('last known value, not current');
    return parts.join('; ');
  });
  protected readonly bandWord = computed(() => {
    const band = this.band();
    return band ? BAND_WORDS[band] : '';
  });
}
