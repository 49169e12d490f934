import {
  ChangeDetectionStrategy,
  Component,
  LOCALE_ID,
  computed,
  inject,
  input,
  signal,
  viewChild,
} from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { Router } from '@angular/router';
import type { ChartOptions } from 'chart.js';
import annotationPlugin from 'chartjs-plugin-annotation';
import zoomPlugin from 'chartjs-plugin-zoom';
import { provideChartSetup } from '../core/chart-setup';
import { ChartFigure } from '../core/chart-figure/chart-figure';
import { switchMap } from 'rxjs';
import { AlertsApi } from '../core/alerts-api';
import { Api } from '../core/api';
import { ChartColours } from '../core/chart-palette';
import { loadError, loadedOr } from '../core/load-state';
import { DateTimePipe } from '../core/date-time-pipe';
import { flagText } from '../core/flag-text';
import { Preferences } from '../core/preferences';
import { SystemNav } from '../core/system-nav/system-nav';
import { describeSeries } from '../core/describe-series';
import { historyAlerts, historyReadings, resolutionText } from './history-feeds';
import { CustomRange } from './custom-range/custom-range';
import { historyChartOptions } from './history-chart-options';
import {
  PRESET_LABELS,
  RangePreset,
  TimeRange,
  matchingPreset,
  presetRange,
  rangeFromQuery,
  widen,
} from '../core/time-range';
import { HISTORY_SERIES, HistorySeries, seriesLabel, toHistorySeries } from './to-history-series';

/** One system's stored readings over a chosen range, with its alerts marked on the time axis. */
@Component({
  selector: 'cw-history',
  changeDetection: ChangeDetectionStrategy.OnPush,
  // Alert bands and drag to zoom; registered here so the plugins load with this page only.
  providers: [provideChartSetup(annotationPlugin, zoomPlugin)],
  imports: [
    MatButtonModule,
    MatButtonToggleModule,
    MatCheckboxModule,
    MatIconModule,
    MatProgressSpinnerModule,
    ChartFigure,
    DateTimePipe,
    SystemNav,
    CustomRange,
  ],
  templateUrl: './history.html',
  styleUrl: './history.scss',
})
export class History {
  private readonly api = inject(Api);
  private readonly alertsApi = inject(AlertsApi);
  private readonly router = inject(Router);
  private readonly preferences = inject(Preferences);
  private readonly locale = inject(LOCALE_ID);
  private readonly colours = inject(ChartColours);

  /** The system id from the route. */
  readonly id = input.required<string>();
  /** Start of the range from `?from=` (ISO 8601 or epoch ms). */
  readonly from = input<string>();
  /** End of the range from `?to=`. */
  readonly to = input<string>();

  private readonly customRange = viewChild(CustomRange);
  protected readonly presets = Object.keys(PRESET_LABELS) as RangePreset[];
  protected readonly presetLabels = PRESET_LABELS;
  protected readonly range = computed(() => rangeFromQuery(this.from(), this.to(), Date.now()));
  protected readonly preset = computed(() => matchingPreset(this.range(), Date.now()) ?? 'custom');

  private readonly request = computed(() => ({ id: this.id(), range: this.range() }));
  private readonly request$ = toObservable(this.request);
  protected readonly readings = toSignal(
    this.request$.pipe(switchMap(({ id, range }) => historyReadings(this.api, id, range))),
    { initialValue: { status: 'loading' as const } },
  );
  protected readonly alerts = toSignal(
    this.request$.pipe(switchMap(({ id, range }) => historyAlerts(this.alertsApi, id, range))),
    { initialValue: { status: 'loading' as const } },
  );

  protected readonly readingsProblem = computed(() => loadError(this.readings()));
  protected readonly alertsProblem = computed(() => loadError(this.alerts()));
  protected readonly points = computed(() => loadedOr(this.readings(), null)?.points ?? []);
  protected readonly resolution = computed(() => {
    const history = loadedOr(this.readings(), null);
    return history ? resolutionText(history.resolution) : null;
  });
  protected readonly alertList = computed(() => {
    const alerts = loadedOr(this.alerts(), []);
    const { from, to } = this.range();
    return alerts
      .filter((a) => overlaps(a, from, to))
      .sort((a, b) => a.startedAt - b.startedAt)
      .map((alert) => ({ ...alert, title: flagText(alert.kind).title }));
  });
  /** Series the person switched off; every series starts shown. */
  protected readonly hiddenSeries = signal<ReadonlySet<HistorySeries>>(new Set());
  protected readonly seriesSwitches = computed(() =>
    HISTORY_SERIES.map((series) => ({
      series,
      label: seriesLabel(series, this.preferences.temperatureUnit()),
      color: this.colours.palette()[series],
      shown: !this.hiddenSeries().has(series),
    })),
  );
  protected readonly chartData = computed(() =>
    toHistorySeries(
      this.points(),
      this.preferences.temperatureUnit(),
      this.hiddenSeries(),
      this.colours.palette(),
    ),
  );
  protected readonly chartOptions = computed<ChartOptions<'line'>>(() =>
    historyChartOptions(
      this.range(),
      this.alertList(),
      this.preferences.temperatureUnit(),
      this.locale,
      (range) => this.showRange(range),
      this.colours.palette(),
    ),
  );
  protected readonly shownNames = computed(() =>
    this.seriesSwitches()
      .filter((s) => s.shown)
      .map((s) => s.label.replace(/ \(.*\)$/, '').toLowerCase()),
  );
  protected readonly chartSummary = computed(() => {
    const alerts = this.alertList().length;
    const alertWords = alerts === 0 ? 'no alerts' : alerts === 1 ? '1 alert' : `${alerts} alerts`;
    return `${describeSeries(this.points(), 'in this range')} ${alertWords} in this range.`;
  });

  /** Shows or hides one series (its axis goes with it). */
  protected toggleSeries(series: HistorySeries, shown: boolean): void {
    const hidden = new Set(this.hiddenSeries());
    if (shown) hidden.delete(series);
    else hidden.add(series);
    this.hiddenSeries.set(hidden);
  }

  /** Shows a preset range ending now. */
  protected choosePreset(preset: RangePreset | 'custom'): void {
    if (preset === 'custom') this.customRange()?.focusStart();
    else this.showRange(presetRange(preset, Date.now()));
  }

  /** Shows twice the current span. */
  protected zoomOut(): void {
    this.showRange(widen(this.range(), Date.now()));
  }

  /** Puts a range in the address so it can be shared and the back button undoes a zoom. */
  protected showRange(range: TimeRange): void {
    void this.router.navigate(['/systems', this.id(), 'history'], {
      queryParams: { from: new Date(range.from).toISOString(), to: new Date(range.to).toISOString() },
    });
  }
}

// The server filters by range too; this keeps the list and the bands in step with the axis.
function overlaps(alert: { startedAt: number; endedAt: number | null }, from: number, to: number): boolean {
  return alert.startedAt <= to && (alert.endedAt ?? Infinity) >= from;
}
