import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatButtonModule } from '@angular/material/button';
import { RouterLink } from '@angular/router';
import { catchError, map, of, startWith } from 'rxjs';
import { Api } from '../core/api';
import { currentDirection } from '../core/current-direction';
import { injectNow } from '../core/now';
import type { SystemSummary } from '../core/system-summary';
import { isStale } from './is-stale';

type SystemsState =
  { status: 'loading' } | { status: 'error' } | { status: 'loaded'; systems: SystemSummary[] };

/** Home screen: the systems the user may see with their latest values. */
@Component({
  selector: 'cw-systems',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    MatCardModule,
    MatIconModule,
    MatProgressSpinnerModule,
    MatButtonModule,
    RouterLink,
    DecimalPipe,
    DatePipe,
  ],
  templateUrl: './systems.html',
  styleUrl: './systems.scss',
})
export class Systems {
  private readonly api = inject(Api);
  protected readonly now = injectNow();

  protected readonly state = toSignal(
    this.api.systems().pipe(
      map((systems): SystemsState => ({ status: 'loaded', systems })),
      catchError(() => of<SystemsState>({ status: 'error' })),
      startWith<SystemsState>({ status: 'loading' }),
    ),
    { requireSync: true },
  );
  protected readonly systems = computed(() => {
    const state = this.state();
    return state.status === 'loaded' ? state.systems : [];
  });

  protected isStale(system: SystemSummary): boolean {
    return isStale(system.latestReading?.measuredAt, this.now());
  }

  protected direction(current: number): string {
    return currentDirection(current);
  }
}
