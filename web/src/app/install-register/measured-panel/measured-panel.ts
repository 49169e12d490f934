import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import type { CircuitDesignVsMeasured, RatingComparison } from '@cellwarden/shared';
import { combineLatest, switchMap } from 'rxjs';
import { apiProblem } from '../../core/api-error';
import { LoadState, toLoadState } from '../../core/load-state';
import { Preferences } from '../../core/preferences';
import { InstallRegisterApi } from '../install-register-api';
import { measuredSentence } from './measured-sentence';

const RATING_NAMES: Record<RatingComparison['rating'], string> = {
  fuse: 'Fuse or breaker',
  conductor: 'Conductor (derated)',
  'bms-continuous': 'BMS continuous',
  'bms-peak': 'BMS peak',
};

/** What the monitor measured on each circuit it sees, against the circuit's fuse, conductor and the BMS. */
@Component({
  selector: 'cw-measured-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DecimalPipe, MatButtonToggleModule, MatIconModule, MatProgressSpinnerModule],
  templateUrl: './measured-panel.html',
  styleUrl: './measured-panel.scss',
})
export class MeasuredPanel {
  private readonly api = inject(InstallRegisterApi);
  private readonly unit = inject(Preferences).temperatureUnit;

  /** The system whose circuits are compared. */
  readonly systemId = input.required<string>();
  /** Changes when the register changed, so the comparison is asked again. */
  readonly revision = input(0);

  protected readonly days = signal(7);
  protected readonly measured = toSignal(
    combineLatest([toObservable(this.systemId), toObservable(this.days), toObservable(this.revision)]).pipe(
      switchMap(([id, days]) =>
        toLoadState(this.api.measured(id, days), (error) => apiProblem(error).message),
      ),
    ),
    { initialValue: { status: 'loading' } as LoadState<CircuitDesignVsMeasured[]> },
  );

  protected sentence(circuit: CircuitDesignVsMeasured): string {
    return measuredSentence(circuit, this.unit());
  }

  protected ratingName(rating: RatingComparison['rating']): string {
    return RATING_NAMES[rating];
  }

  protected setDays(days: number): void {
    this.days.set(days);
  }
}
