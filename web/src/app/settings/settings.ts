import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  Injector,
  LOCALE_ID,
  afterNextRender,
  computed,
  effect,
  inject,
  input,
  signal,
  untracked,
  viewChild,
} from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSelectModule } from '@angular/material/select';
import type { SystemSettings } from '@cellwarden/shared';
import { switchMap } from 'rxjs';
import { AccessApi } from '../core/access-api';
import { Api } from '../core/api';
import { ApiProblem, apiProblem } from '../core/api-error';
import { loadError } from '../core/load-state';
import { configureRight, readOnlyReason, rightsLoad } from '../core/configure-right';
import { formatInstant } from '../core/date-time';
import { Preferences } from '../core/preferences';
import { SettingsApi } from '../core/settings-api';
import { SystemNav } from '../core/system-nav/system-nav';
import { TemperatureUnit, inUnit, toCelsius } from '../core/temperature-unit';
import { ChargeSources } from './charge-sources/charge-sources';
import { PreferencesForm } from './preferences-form/preferences-form';
import { settingsLoad } from './settings-feed';
import { OVER_TEMPERATURE_RANGE_C, fillSettingsForm, readSettingsForm, settingsForm } from './settings-form';
import { ThresholdField } from './threshold-field/threshold-field';

/** One system's settings: description, battery, BMS limits, charge sources and flag thresholds; and the person's preferences. */
@Component({
  selector: 'cw-settings',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    MatProgressSpinnerModule,
    SystemNav,
    ChargeSources,
    ThresholdField,
    PreferencesForm,
  ],
  templateUrl: './settings.html',
  styleUrl: './settings.scss',
})
export class Settings {
  private readonly api = inject(SettingsApi);
  private readonly preferences = inject(Preferences);
  private readonly injector = inject(Injector);
  private readonly accessApi = inject(AccessApi);
  private readonly systemsApi = inject(Api);
  private readonly locale = inject(LOCALE_ID);

  /** The system id from the route. */
  readonly id = input.required<string>();

  protected readonly unit = this.preferences.temperatureUnit;
  protected readonly form = settingsForm(() => this.unit());
  protected readonly load = toSignal(
    toObservable(this.id).pipe(switchMap((id) => settingsLoad(this.api, id))),
    {
      initialValue: { status: 'loading' as const },
    },
  );
  private readonly rights = toSignal(
    toObservable(this.id).pipe(switchMap((id) => rightsLoad(this.systemsApi, this.accessApi, id))),
    {
      initialValue: null,
    },
  );
  /** Known before the person tries: what the access rule lets them do here. */
  private readonly right = computed(() => {
    const rights = this.rights();
    if (!rights) return null;
    return configureRight(rights.allowed, rights.received, this.id());
  });
  protected readonly saving = signal(false);
  /** Set when the server refused a save the form did not know to be refused. */
  private readonly refused = signal(false);
  protected readonly readOnly = computed(() => this.refused() || this.right()?.canConfigure === false);
  protected readonly readOnlyReason = computed(() =>
    readOnlyReason(
      this.right() ?? { canConfigure: false, viewGrant: null },
      'you can see these settings but not change them',
      (ms) => formatInstant(ms, 'dateTime', this.locale),
    ),
  );
  protected readonly loadProblem = computed(() => loadError(this.load()));
  protected readonly problem = signal<ApiProblem | null>(null);
  protected readonly saved = signal(false);
  protected readonly overTemperatureRange = computed(() => {
    const [min, max] = [OVER_TEMPERATURE_RANGE_C.min, OVER_TEMPERATURE_RANGE_C.max].map((c) =>
      Math.round(inUnit(c, this.unit())),
    );
    return `Between ${min} and ${max} °${this.unit()}.`;
  });
  protected readonly defaults = computed(() => {
    const load = this.load();
    const defaults = load.status === 'loaded' ? load.value.thresholdDefaults : undefined;
    if (!defaults) return null;
    return {
      ...defaults,
      overTemperatureC: Math.round(inUnit(defaults.overTemperatureC, this.unit()) * 10) / 10,
    };
  });
  private readonly readOnlyNote = viewChild<ElementRef<HTMLElement>>('readOnlyNote');
  private shownUnit: TemperatureUnit = this.unit();

  constructor() {
    effect(() => {
      const load = this.load();
      if (load.status === 'loaded') untracked(() => this.fill(load.value));
    });
    effect(() => this.convertTemperature(this.unit()));
    effect(() => {
      if (this.readOnly()) untracked(() => this.form.disable());
    });
  }

  protected save(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.saving() || this.readOnly()) return;
    this.saving.set(true);
    this.problem.set(null);
    this.saved.set(false);
    this.api.saveSettings(this.id(), readSettingsForm(this.form, this.unit())).subscribe({
      next: (settings) => {
        this.saving.set(false);
        this.saved.set(true);
        this.fill(settings);
      },
      error: (error: unknown) => this.showProblem(apiProblem(error)),
    });
  }

  protected discard(): void {
    const load = this.load();
    if (load.status === 'loaded') this.fill(load.value);
  }

  private fill(settings: SystemSettings): void {
    fillSettingsForm(this.form, settings, this.unit());
    this.shownUnit = this.unit();
    if (this.readOnly()) this.form.disable();
  }

  private showProblem(problem: ApiProblem): void {
    this.saving.set(false);
    if (problem.status === 403) {
      // The person may see this system but not configure it.
      this.refused.set(true);
      // The note is at the top of a long form; bring it into view where the person is.
      afterNextRender(() => this.readOnlyNote()?.nativeElement.focus(), { injector: this.injector });
      return;
    }
    const control = problem.field ? this.form.get(problem.field) : null;
    if (control) {
      control.setErrors({ server: problem.message });
      control.markAsTouched();
    }
    this.problem.set(problem);
  }

  // The over-temperature field holds the unit shown; when the person switches unit, convert what is typed.
  private convertTemperature(unit: TemperatureUnit): void {
    if (unit === this.shownUnit) return;
    const control = this.form.controls.thresholds.controls.overTemperatureC;
    if (control.value != null) {
      const celsius = toCelsius(control.value, this.shownUnit);
      control.setValue(Math.round(inUnit(celsius, unit) * 10) / 10);
    }
    this.shownUnit = unit;
  }
}
