import { DOCUMENT, DecimalPipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  LOCALE_ID,
  afterRenderEffect,
  computed,
  inject,
  input,
  signal,
} from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import type { ChartOptions } from 'chart.js';
import { provideChartSetup } from '../core/chart-setup';
import { ChartFigure } from '../core/chart-figure/chart-figure';
import { asyncScheduler, switchMap, throttleTime } from 'rxjs';
import { Api } from '../core/api';
import { ChartColours } from '../core/chart-palette';
import { loadError, loadedOr } from '../core/load-state';
import { currentDirection } from '../core/current-direction';
import { formatInstant, viewerTimeZone } from '../core/date-time';
import { DateTimePipe } from '../core/date-time-pipe';
import { LiveHeadStart } from '../core/live-head-start';
import { LiveStream } from '../core/live-stream';
import { injectNow } from '../core/now';
import { SettingsApi } from '../core/settings-api';
import { isStale } from '../core/staleness';
import { SystemNav } from '../core/system-nav/system-nav';
import { TemperaturePipe } from '../core/temperature-pipe';
import { BankMonitors } from './bank-monitors/bank-monitors';
import { ChargeColumn } from './charge-column/charge-column';
import { isColdCharging } from './cold-charge';
import { describeSeries } from '../core/describe-series';
import { removeFirstGlance } from './first-glance';
import { FlagList } from './flag-list/flag-list';
import { liveChartPoints, liveStates, systemOrMissing, systemSettings } from './live-feeds';
import { leadMonitorId, type ActiveFlag } from './live-state';
import { ampHoursRemaining, morningHeadline } from './morning-headline';
import { formatHours } from './runtime-text';
import { sourceShares } from './source-shares';
import { toChartSeries } from './to-chart-series';

/**
 * The chart redraws at most this often, ms: each redraw lays out three hours of points again, and a monitor
 * reporting several times a second would keep the main thread busy with it; a second is well below one
 * pixel of a three-hour line.
 */
const CHART_REDRAW_MS = 1000;

/** One system's values now: charge, flows, runtime, flags and the last hours. */
@Component({
  selector: 'cw-live',
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [provideChartSetup()],
  imports: [
    MatCardModule,
    MatIconModule,
    MatProgressSpinnerModule,
    ChartFigure,
    DecimalPipe,
    DateTimePipe,
    TemperaturePipe,
    SystemNav,
    ChargeColumn,
    FlagList,
    BankMonitors,
  ],
  templateUrl: './live.html',
  styleUrl: './live.scss',
})
export class Live {
  private readonly api = inject(Api);
  private readonly settingsApi = inject(SettingsApi);
  private readonly stream = inject(LiveStream);
  private readonly headStart = inject(LiveHeadStart);
  private readonly locale = inject(LOCALE_ID);
  private readonly colours = inject(ChartColours);
  private readonly document = inject(DOCUMENT);
  protected readonly now = injectNow(5_000);

  /** The system id from the route. */
  readonly id = input.required<string>();

  private readonly id$ = toObservable(this.id);
  // The description the page's head-start script asked for (its first glance needed it), else a new request.
  protected readonly system = toSignal(this.id$.pipe(switchMap((id) => systemOrMissing(this.headStart, id))));
  protected readonly load = toSignal(
    // The status and stream the route's head start asked for while this view's code loaded (else new ones).
    this.id$.pipe(switchMap((id) => liveStates(this.headStart, this.headStart, id))),
    {
      initialValue: { status: 'loading' as const },
    },
  );
  private readonly settings = toSignal(
    this.id$.pipe(switchMap((id) => systemSettings(this.settingsApi, id))),
    {
      initialValue: null,
    },
  );
  private readonly labels = computed<Record<string, string>>(() =>
    Object.fromEntries((this.settings()?.chargeSources ?? []).map((s) => [s.id, s.label])),
  );
  /** The system's clock: projections are about its morning. Until its settings arrive, the viewer's. */
  protected readonly systemZone = computed(() => this.settings()?.timeZone ?? viewerTimeZone());
  // The chart follows the lead monitor, like the headline; until the status names it, every reading counts.
  private readonly points = toSignal(
    this.id$.pipe(
      switchMap((id) =>
        liveChartPoints(this.api, this.stream, id, (deviceId) => {
          const lead = this.leadId();
          return lead === null || deviceId === undefined || deviceId === lead;
        }).pipe(throttleTime(CHART_REDRAW_MS, asyncScheduler, { leading: true, trailing: true })),
      ),
    ),
    {
      initialValue: [],
    },
  );

  protected readonly connectionState = this.stream.connectionState;
  protected readonly state = computed(() => loadedOr(this.load(), null));
  protected readonly problem = computed(() => loadError(this.load()));
  protected readonly summary = computed(() => {
    const system = this.system();
    return system && system !== 'missing' ? system : null;
  });
  protected readonly reading = computed(() => this.state()?.reading ?? null);
  private readonly leadId = computed(() => {
    const state = this.state();
    return state ? leadMonitorId(state) : null;
  });
  protected readonly derived = computed(() => this.state()?.derived ?? null);
  protected readonly stale = computed(() =>
    isStale(this.reading()?.measuredAt, this.now(), this.state()?.intervalMs),
  );
  protected readonly power = computed(() => {
    const reading = this.reading();
    return reading ? (reading.power ?? reading.voltage * reading.current) : null;
  });
  protected readonly direction = computed(() => currentDirection(this.reading()?.current ?? 0));
  protected readonly stateOfCharge = computed(
    () => this.derived()?.stateOfCharge ?? this.reading()?.stateOfCharge ?? null,
  );
  protected readonly runtime = computed(() => runtimeText(this.direction(), this.derived()));
  protected readonly headline = computed(() =>
    morningHeadline(this.derived(), {
      now: this.reading()?.measuredAt ?? this.now(),
      locale: this.locale,
      systemZone: this.systemZone(),
      viewerZone: viewerTimeZone(),
    }),
  );
  protected readonly ampHours = computed(() =>
    ampHoursRemaining(
      this.stateOfCharge(),
      this.settings()?.battery.usableCapacityAh ?? this.summary()?.usableCapacityAh ?? null,
    ),
  );
  protected readonly lowAt = computed(() => {
    const at = this.derived()?.byMorning?.crossesLowAt;
    return at ? formatInstant(at, 'time', this.locale, this.systemZone()) : null;
  });
  protected readonly shares = computed(() => sourceShares(this.reading()?.sourceCurrents, this.labels()));
  protected readonly flags = computed(() =>
    withColdCharge(this.state()?.flags ?? [], this.coldCharging(), this.reading()?.measuredAt),
  );
  // The chart gets its points only once the values above it are on screen (see the constructor).
  private readonly chartShown = signal(false);
  protected readonly chartData = computed(() =>
    toChartSeries(this.chartShown() ? this.points() : [], this.colours.palette()),
  );
  protected readonly chartSummary = computed(() => describeSeries(this.points(), 'in the last 3 hours'));
  protected readonly chartOptions: ChartOptions<'line'> = {
    animation: false,
    maintainAspectRatio: false,
    parsing: false,
    interaction: { mode: 'nearest', axis: 'x', intersect: false },
    plugins: {
      tooltip: {
        callbacks: { title: (items) => formatInstant(items[0]?.parsed.x ?? null, 'dateTime', this.locale) },
      },
    },
    scales: {
      x: {
        type: 'time',
        ticks: { callback: (value) => formatInstant(Number(value), 'time', this.locale) },
      },
      voltage: { type: 'linear', position: 'left', title: { display: true, text: 'V' } },
      current: {
        type: 'linear',
        position: 'right',
        title: { display: true, text: 'A' },
        grid: { drawOnChartArea: false },
      },
    },
  };

  constructor() {
    // The first glance the head-start script painted gives way in the same task as this view's values (or its
    // message) render, before the browser paints: never both on screen, never a gap between them.
    afterRenderEffect(() => {
      if (this.load().status !== 'loading' || this.system() === 'missing') removeFirstGlance(this.document);
    });
    inject(DestroyRef).onDestroy(() => removeFirstGlance(this.document));
    // chart.js lays out its axes and draws in the same task as the tiles render (about 300 ms for three hours
    // of readings on a busy 2-core machine), so the first values would wait for the chart. It gets its points
    // after the frame that shows the values: the animation frame comes before that paint, the timeout after it.
    afterRenderEffect(() => {
      if (this.chartShown() || !this.state()) return;
      requestAnimationFrame(() => setTimeout(() => this.chartShown.set(true)));
    });
  }

  private coldCharging(): boolean {
    const reading = this.reading();
    const summary = this.summary();
    return !!reading && !!summary && !this.stale() && isColdCharging(summary.chemistry, reading);
  }
}

function runtimeText(
  direction: ReturnType<typeof currentDirection>,
  derived: { hoursToEmpty: number | null; hoursToFull: number | null } | null,
): { label: string; value: string } {
  if (direction === 'charging') {
    return { label: 'Time to full', value: formatHours(derived?.hoursToFull) ?? '—' };
  }
  if (direction === 'discharging') {
    return { label: 'Time to empty', value: formatHours(derived?.hoursToEmpty) ?? '—' };
  }
  return { label: 'Runtime', value: 'Idle: no net flow' };
}

// The server raises this flag too; the local check covers the gap until its alert arrives.
function withColdCharge(flags: ActiveFlag[], coldCharging: boolean, measuredAt = Date.now()): ActiveFlag[] {
  if (!coldCharging || flags.some((f) => f.kind === 'cold-charging')) return flags;
  return [...flags, { kind: 'cold-charging', severity: 'critical', since: measuredAt, peakValue: null }];
}
