import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { BatteryReading } from '@cellwarden/shared';
import type { ChartOptions } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';
import { catchError, concat, map, of, scan, switchMap } from 'rxjs';
import { Api } from '../core/api';
import { currentDirection } from '../core/current-direction';
import { LiveStream } from '../core/live-stream';
import { injectNow } from '../core/now';
import type { HistoryPoint, SystemSummary } from '../core/system-summary';
import { isStale } from '../systems/is-stale';
import { isColdCharging } from './cold-charge';
import { ChartPoint, appendWithin, toChartSeries } from './to-chart-series';

const CHART_WINDOW_MS = 60 * 60 * 1000;

/** One system's live values and chart. */
@Component({
  selector: 'cw-live',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatCardModule, MatIconModule, RouterLink, BaseChartDirective, DecimalPipe, DatePipe],
  templateUrl: './live.html',
  styleUrl: './live.scss',
})
export class Live {
  private readonly api = inject(Api);
  private readonly stream = inject(LiveStream);
  protected readonly now = injectNow(5_000);

  /** The system id from the route. */
  readonly id = input.required<string>();

  private readonly id$ = toObservable(this.id);
  protected readonly system = toSignal(
    this.id$.pipe(
      switchMap((id) =>
        this.api.system(id).pipe(
          map((system): SystemSummary | 'missing' => system),
          catchError(() => of('missing' as const)),
        ),
      ),
    ),
  );
  private readonly liveReading = toSignal(this.id$.pipe(switchMap((id) => this.stream.readings(id))));
  private readonly points = toSignal(this.id$.pipe(switchMap((id) => this.chartPoints(id))), {
    initialValue: [] as ChartPoint[],
  });

  protected readonly connectionState = this.stream.connectionState;
  protected readonly summary = computed(() => {
    const system = this.system();
    return system && system !== 'missing' ? system : null;
  });
  protected readonly reading = computed<BatteryReading | null>(
    () => this.liveReading() ?? this.summary()?.latestReading ?? null,
  );
  protected readonly power = computed(() => {
    const reading = this.reading();
    return reading ? (reading.power ?? reading.voltage * reading.current) : null;
  });
  protected readonly direction = computed(() => currentDirection(this.reading()?.current ?? 0));
  protected readonly stale = computed(() => isStale(this.reading()?.measuredAt, this.now()));
  protected readonly coldCharging = computed(() => {
    const reading = this.reading();
    const summary = this.summary();
    return !!reading && !!summary && isColdCharging(summary.chemistry, reading);
  });
  protected readonly chartData = computed(() => toChartSeries(this.points()));
  protected readonly chartLabel = computed(() => {
    const reading = this.reading();
    return reading
      ? `Chart of voltage and current over the last hour; latest ${reading.voltage.toFixed(2)} V and ${reading.current.toFixed(1)} A`
      : 'Chart of voltage and current over the last hour; no readings yet';
  });
  protected readonly chartOptions: ChartOptions<'line'> = {
    animation: false,
    maintainAspectRatio: false,
    parsing: false,
    scales: {
      x: { type: 'time', time: { tooltipFormat: 'HH:mm:ss' } },
      voltage: { type: 'linear', position: 'left', title: { display: true, text: 'V' } },
      current: {
        type: 'linear',
        position: 'right',
        title: { display: true, text: 'A' },
        grid: { drawOnChartArea: false },
      },
    },
  };

  private chartPoints(id: string) {
    const to = new Date();
    const from = new Date(to.getTime() - CHART_WINDOW_MS);
    const history = this.api.readings(id, from, to).pipe(catchError(() => of([] as HistoryPoint[])));
    return concat(
      history.pipe(map((points) => ({ kind: 'seed' as const, points }))),
      this.stream.readings(id).pipe(map((reading) => ({ kind: 'live' as const, reading }))),
    ).pipe(
      scan<{ kind: 'seed'; points: ChartPoint[] } | { kind: 'live'; reading: ChartPoint }, ChartPoint[]>(
        (points, event) =>
          event.kind === 'seed' ? [...event.points] : appendWithin(points, event.reading, CHART_WINDOW_MS),
        [],
      ),
    );
  }
}
