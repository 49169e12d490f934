import { BreakpointObserver } from '@angular/cdk/layout';
import { DatePipe, DecimalPipe, NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { SystemStatus } from '@cellwarden/shared';
import { map } from 'rxjs';
import { Api } from '../core/api';
import { loadError } from '../core/load-state';
import { Auth } from '../core/auth';
import { injectNow } from '../core/now';
import { FleetRow, fleetSortValue, matchesSearch, toFleetRow } from './fleet-row';
import { fleetLoad, statusesOf } from './fleet-feeds';

/** The fleet: every system the user may see, worst first, with search and sort; cards on a phone. */
@Component({
  selector: 'cw-systems',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    MatCardModule,
    MatIconModule,
    MatProgressSpinnerModule,
    MatButtonModule,
    MatTableModule,
    MatSortModule,
    MatFormFieldModule,
    MatInputModule,
    RouterLink,
    DecimalPipe,
    DatePipe,
    NgTemplateOutlet,
  ],
  templateUrl: './systems.html',
  styleUrl: './systems.scss',
})
export class Systems {
  private readonly api = inject(Api);
  private readonly breakpoints = inject(BreakpointObserver);
  protected readonly now = injectNow();
  private readonly auth = inject(Auth);
  /** Installers and owners set up new systems from here. */
  protected readonly canSetUp = computed(() => this.auth.hasAnyRole(['installer', 'owner']));

  protected readonly state = toSignal(fleetLoad(this.api), { requireSync: true });
  private readonly statuses = toSignal(statusesOf(this.api, this.state), {
    initialValue: new Map<string, SystemStatus>(),
  });
  protected readonly isPhone = toSignal(
    this.breakpoints.observe('(max-width: 599.98px)').pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  protected readonly search = signal('');
  protected readonly sort = signal<Sort>({ active: 'flags', direction: 'desc' });
  protected readonly columns = ['name', 'lastSeen', 'stateOfCharge', 'voltage', 'flags'];

  protected readonly problem = computed(() => loadError(this.state()));
  protected readonly rows = computed(() => {
    const state = this.state();
    if (state.status !== 'loaded') return [];
    const statuses = this.statuses();
    return state.value.map((s) => toFleetRow(s, statuses.get(s.id) ?? null, this.now()));
  });
  protected readonly visibleRows = computed(() =>
    sortRows(
      this.rows().filter((row) => matchesSearch(row, this.search())),
      this.sort(),
    ),
  );

  protected updateSearch(event: Event): void {
    this.search.set((event.target as HTMLInputElement).value);
  }

  protected statusWords(row: FleetRow): string {
    if (row.worst === 'critical') return 'Critical flag';
    if (row.worst === 'warning') return 'Warning';
    if (row.silent) return row.lastSeenAt ? 'Silent' : 'No readings yet';
    return 'OK';
  }
}

function sortRows(rows: FleetRow[], sort: Sort): FleetRow[] {
  if (!sort.direction) return rows;
  const sign = sort.direction === 'asc' ? 1 : -1;
  return [...rows].sort((a, b) => {
    const x = fleetSortValue(a, sort.active);
    const y = fleetSortValue(b, sort.active);
    return (x < y ? -1 : x > y ? 1 : 0) * sign || a.name.localeCompare(b.name);
  });
}
