import {
  ChangeDetectionStrategy,
  Component,
  effect,
  inject,
  input,
  output,
  signal,
  untracked,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import type { RegisterCircuit, RegisterComponent } from '@cellwarden/shared';
import { TemperatureUnit, inUnit, toCelsius } from '../../core/temperature-unit';
import {
  AWG_CHOICES,
  circuitForm,
  controlPathOf,
  fillCircuitForm,
  readCircuitForm,
} from '../circuit-form-model';
import { InstallRegisterApi } from '../install-register-api';
import { REGISTER_FORM_IMPORTS, fieldError, saveWithFieldErrors } from '../register-form';

/** Adds a circuit to the register, or edits the one given; the server answers with its verdict. */
@Component({
  selector: 'cw-circuit-editor',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [REGISTER_FORM_IMPORTS],
  templateUrl: './circuit-editor.html',
  styleUrl: '../register-form.scss',
})
export class CircuitEditor {
  private readonly api = inject(InstallRegisterApi);

  /** The system the register belongs to. */
  readonly systemId = input.required<string>();
  /** The components a circuit may feed. */
  readonly components = input.required<readonly RegisterComponent[]>();
  /** The person's temperature unit, for the ambient. */
  readonly unit = input.required<TemperatureUnit>();
  /** The circuit being edited; null adds a new one. */
  readonly editing = input<RegisterCircuit | null>(null);
  /** Emitted with the stored circuit and its verdict. */
  readonly saved = output<RegisterCircuit>();
  /** Emitted when the person gives up the edit. */
  readonly cancelled = output<void>();

  protected readonly form = circuitForm();
  protected readonly awgChoices = AWG_CHOICES;
  protected readonly conductorKind = toSignal(this.form.controls.conductorKind.valueChanges, {
    initialValue: this.form.controls.conductorKind.value,
  });
  protected readonly saving = signal(false);
  protected readonly problem = signal<string | null>(null);
  private shownUnit: TemperatureUnit | null = null;

  constructor() {
    effect(() => {
      const editing = this.editing();
      untracked(() => {
        if (editing) fillCircuitForm(this.form, editing, this.unit());
        else this.form.reset();
        this.shownUnit = this.unit();
      });
    });
    effect(() => this.convertAmbient(this.unit()));
  }

  protected save(): void {
    saveWithFieldErrors(
      this.form,
      { saving: this.saving, problem: this.problem },
      {
        request: () =>
          this.api.saveCircuit(this.systemId(), readCircuitForm(this.form, this.unit()), this.editing()?.id),
        controlFor: (field) => controlPathOf(field, this.form.controls.conductorKind.value),
        saved: (circuit) => {
          this.form.reset();
          this.saved.emit(circuit);
        },
      },
    );
  }

  protected cancel(): void {
    this.form.reset();
    this.cancelled.emit();
  }

  protected errorOf(name: string, label: string): string | null {
    return fieldError(this.form, name, label);
  }

  /** An insulation rating in the person's unit (the rating itself is named in °C on the cable). */
  protected ratingLabel(celsius: number): string {
    return this.unit() === 'F'
      ? `${Math.round(inUnit(celsius, 'F'))} °F (rated ${celsius} °C)`
      : `${celsius} °C`;
  }

  // The ambient field holds the unit shown; when the person switches unit, convert what is typed.
  private convertAmbient(unit: TemperatureUnit): void {
    if (this.shownUnit === null || unit === this.shownUnit) return;
    const control = this.form.controls.ambient;
    if (control.value != null)
      control.setValue(Math.round(inUnit(toCelsius(control.value, this.shownUnit), unit) * 10) / 10);
    this.shownUnit = unit;
  }
}
