import { BreakpointObserver } from '@angular/cdk/layout';
import {
  ChangeDetectionStrategy,
  Component,
  LOCALE_ID,
  computed,
  inject,
  input,
  linkedSignal,
  signal,
} from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { AlertEvent } from '@cellwarden/shared';
import { map, switchMap } from 'rxjs';
import { AccessApi } from '../core/access-api';
import { Api } from '../core/api';
import { AlertsApi } from '../core/alerts-api';
import { configureRight, readOnlyReason, rightsLoad } from '../core/configure-right';
import { formatInstant } from '../core/date-time';
import { loadError, loadedOr } from '../core/load-state';
import { DateTimePipe } from '../core/date-time-pipe';
import { Preferences } from '../core/preferences';
import { SystemNav } from '../core/system-nav/system-nav';
import { AcknowledgeData, AcknowledgeDialog } from './acknowledge-dialog/acknowledge-dialog';
import {
  AlertFilter,
  AlertRow,
  alertMatches,
  alertSortValue,
  endsOnAnotherDay,
  momentQuery,
  peakText,
  toAlertRow,
} from './alert-row';
import { alertsLoad } from './alerts-feed';

/** Every recorded alert of one system: sort, filter, page, acknowledge, and jump to its moment in history. */
@Component({
  selector: 'cw-alerts',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    MatTableModule,
    MatSortModule,
    MatPaginatorModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    MatProgressSpinnerModule,
    RouterLink,
    DateTimePipe,
    SystemNav,
  ],
  templateUrl: './alerts.html',
  styleUrl: './alerts.scss',
})
export class Alerts {
  private readonly api = inject(AlertsApi);
  private readonly dialog = inject(MatDialog);
  private readonly preferences = inject(Preferences);
  private readonly breakpoints = inject(BreakpointObserver);
  private readonly accessApi = inject(AccessApi);
  private readonly systemsApi = inject(Api);
  private readonly locale = inject(LOCALE_ID);

  /** The system id from the route. */
  readonly id = input.required<string>();

  protected readonly load = toSignal(
    toObservable(this.id).pipe(switchMap((id) => alertsLoad(this.api, id))),
    {
      initialValue: { status: 'loading' as const },
    },
  );
  // Acknowledged alerts replace their loaded version here; reset whenever a new list loads.
  private readonly alerts = linkedSignal<AlertEvent[]>(() => loadedOr(this.load(), []));
  protected readonly filter = signal<AlertFilter>({ text: '', state: 'all' });
  protected readonly sort = signal<Sort>({ active: 'startedAt', direction: 'desc' });
  protected readonly page = signal({ index: 0, size: 10 });
  protected readonly isPhone = toSignal(
    this.breakpoints.observe('(max-width: 599.98px)').pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  // On a phone the times and values move under the flag's name instead of columns of their own.
  protected readonly columns = computed(() =>
    this.isPhone()
      ? ['severity', 'title', 'actions']
      : ['severity', 'title', 'startedAt', 'endedAt', 'peakValue', 'state', 'actions'],
  );

  private readonly rights = toSignal(
    toObservable(this.id).pipe(switchMap((id) => rightsLoad(this.systemsApi, this.accessApi, id))),
    {
      initialValue: null,
    },
  );
  /** Why this person may not acknowledge alerts, known before they try; null when they may. */
  protected readonly readOnlyReason = computed(() => {
    const rights = this.rights();
    if (!rights) return null;
    const right = configureRight(rights.allowed, rights.received, this.id());
    if (right.canConfigure) return null;
    return readOnlyReason(right, 'you can read these alerts but not acknowledge them', (ms) =>
      formatInstant(ms, 'dateTime', this.locale),
    );
  });
  protected readonly problemText = computed(() => loadError(this.load()));
  protected readonly rows = computed(() => this.alerts().map(toAlertRow));
  protected readonly matching = computed(() =>
    sortRows(
      this.rows().filter((row) => alertMatches(row, this.filter())),
      this.sort(),
    ),
  );
  protected readonly pageRows = computed(() => {
    const { index, size } = this.page();
    return this.matching().slice(index * size, index * size + size);
  });

  protected setText(event: Event): void {
    this.filter.update((f) => ({ ...f, text: (event.target as HTMLInputElement).value }));
    this.firstPage();
  }

  protected setState(state: AlertFilter['state']): void {
    this.filter.update((f) => ({ ...f, state }));
    this.firstPage();
  }

  protected setPage(event: PageEvent): void {
    this.page.set({ index: event.pageIndex, size: event.pageSize });
  }

  protected readonly endsOnAnotherDay = endsOnAnotherDay;

  protected peak(row: AlertRow): string {
    return peakText(row, this.preferences.temperatureUnit());
  }

  protected moment(row: AlertRow): { from: string; to: string } {
    return momentQuery(row, Date.now());
  }

  protected acknowledgeAlert(row: AlertRow): void {
    const data: AcknowledgeData = { systemId: this.id(), alert: row, title: row.title };
    this.dialog
      .open<AcknowledgeDialog, AcknowledgeData, AlertEvent>(AcknowledgeDialog, {
        data,
        width: '480px',
        maxWidth: '95vw',
      })
      .afterClosed()
      .subscribe((updated) => updated && this.replace(updated));
  }

  private replace(updated: AlertEvent): void {
    this.alerts.update((alerts) => alerts.map((a) => (a.id === updated.id ? updated : a)));
  }

  private firstPage(): void {
    this.page.update((p) => ({ ...p, index: 0 }));
  }
}

function sortRows(rows: AlertRow[], sort: Sort): AlertRow[] {
  if (!sort.direction) return rows;
  const sign = sort.direction === 'asc' ? 1 : -1;
  return [...rows].sort((a, b) => {
    const x = alertSortValue(a, sort.active);
    const y = alertSortValue(b, sort.active);
    return (x < y ? -1 : x > y ? 1 : 0) * sign || b.startedAt - a.startedAt;
  });
}
