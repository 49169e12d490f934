import { ChangeDetectionStrategy, Component, LOCALE_ID, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import type { BatteryHealthResponse } from '@cellwarden/shared';
import type { ChartOptions } from 'chart.js';
import { switchMap } from 'rxjs';
import { LoadState, dataFailure, loadError, loadedOr, toLoadState } from '../core/load-state';
import { provideChartSetup } from '../core/chart-setup';
import { ChartFigure } from '../core/chart-figure/chart-figure';
import { DateTimePipe } from '../core/date-time-pipe';
import { Preferences } from '../core/preferences';
import { SystemNav } from '../core/system-nav/system-nav';
import { TemperaturePipe } from '../core/temperature-pipe';
import { BatteryHealthApi } from './battery-health-api';
import {
  barChartSummary,
  capacityChart,
  depthChart,
  energyChart,
  monthLabel,
  temperatureChart,
} from './health-charts';
import { ReportDownload } from './report-download/report-download';

const BAR_OPTIONS: ChartOptions<'bar'> = {
  responsive: true,
  maintainAspectRatio: false,
  animation: false,
  plugins: { legend: { display: false } },
  scales: { y: { beginAtZero: true } },
};

/** A battery's capacity over months, how it has been used, and its health report. */
@Component({
  selector: 'cw-battery-health',
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [provideChartSetup()],
  imports: [
    MatIconModule,
    MatProgressSpinnerModule,
    ChartFigure,
    DateTimePipe,
    TemperaturePipe,
    SystemNav,
    ReportDownload,
  ],
  templateUrl: './battery-health.html',
  styleUrl: './battery-health.scss',
})
export class BatteryHealth {
  private readonly api = inject(BatteryHealthApi);
  private readonly preferences = inject(Preferences);
  private readonly locale = inject(LOCALE_ID);

  /** The system id from the route. */
  readonly id = input.required<string>();

  protected readonly load = toSignal(
    // The sentences carry temperatures, so a change of unit asks for them again.
    toObservable(computed(() => ({ id: this.id(), unit: this.preferences.temperatureUnit() }))).pipe(
      switchMap(({ id, unit }) =>
        toLoadState(
          this.api.health(id, unit),
          dataFailure('The battery health could not be loaded. Reload the page to try again.'),
        ),
      ),
    ),
    { initialValue: { status: 'loading' } as LoadState<BatteryHealthResponse> },
  );
  protected readonly health = computed(() => loadedOr(this.load(), null));
  protected readonly problem = computed(() => loadError(this.load()));
  protected readonly headline = computed(() => this.health()?.words[0] ?? null);
  protected readonly moreWords = computed(() => this.health()?.words.slice(1) ?? []);
  protected readonly figures = computed(() => this.health()?.figures ?? null);
  protected readonly episodes = computed(() => {
    const f = this.figures();
    if (!f) return [];
    return [
      ...f.coldCharging.map((e) => ({ ...e, kind: 'Charged below freezing' })),
      ...f.hotCharging.map((e) => ({ ...e, kind: 'Charged while hot' })),
    ].sort((a, b) => a.start - b.start);
  });

  protected readonly capacityData = computed(() => {
    const h = this.health();
    return h ? capacityChart(h.capacity, h.usableCapacityAh, this.locale, h.timeZone) : null;
  });
  protected readonly capacityOptions = computed<ChartOptions<'line'>>(() => ({
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    plugins: {
      legend: { labels: { filter: (item) => !item.text.includes('edge of the band') } },
      tooltip: { filter: (item) => !item.dataset.label?.includes('edge of the band') },
    },
    scales: { y: { title: { display: true, text: 'Ah' } } },
  }));
  protected readonly capacitySummary = computed(() => {
    const h = this.health();
    if (!h || h.capacity.months.length === 0) return '';
    return h.capacity.months
      .map(
        (m) =>
          `${monthLabel(m.monthStart, this.locale, h.timeZone)}: ${m.usableAh.toFixed(0)} ± ${m.sigmaAh.toFixed(0)} Ah`,
      )
      .join('; ');
  });
  /** The three bar charts of how the battery has been used, each with its caption and spoken summary. */
  protected readonly barCharts = computed(() => {
    const f = this.figures();
    if (!f) return [];
    return [
      {
        caption: 'Hours by pack temperature',
        unit: 'h',
        data: temperatureChart(f, this.preferences.temperatureUnit()),
      },
      { caption: 'Cycles by depth of discharge', unit: 'cycles', data: depthChart(f) },
      { caption: 'Energy in and out, kWh', name: 'Energy', unit: 'kWh', data: energyChart(f) },
    ].map(({ caption, name = caption, unit, data }) => ({
      caption,
      name: `${name}:`,
      summary: barChartSummary(data, unit),
      data,
    }));
  });
  protected readonly barOptions = BAR_OPTIONS;
  protected readonly percent = (fraction: number) =>
    new Intl.NumberFormat(this.locale, { style: 'percent', maximumFractionDigits: 0 }).format(fraction);
  protected readonly day = (at: number, timeZone: string) =>
    new Intl.DateTimeFormat(this.locale, { dateStyle: 'medium', timeZone }).format(at);
  protected readonly number = (value: number, digits = 0) =>
    new Intl.NumberFormat(this.locale, { maximumFractionDigits: digits }).format(value);
}
