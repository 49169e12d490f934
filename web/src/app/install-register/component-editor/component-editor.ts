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
import type { ComponentKind, RegisterComponent } from '@cellwarden/shared';
import { InstallRegisterApi } from '../install-register-api';
import { REGISTER_FORM_IMPORTS, fieldError, saveWithFieldErrors } from '../register-form';
import { componentForm, fillComponentForm, readComponentForm, showKind } from '../component-form-model';

// Fields the form asks for in per cent, under another name than the API's.
const RENAMED: Record<string, string> = { efficiency: 'efficiencyPercent', dutyCycle: 'dutyPercent' };

/** Adds a component to the register, or edits the one given. */
@Component({
  selector: 'cw-component-editor',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [REGISTER_FORM_IMPORTS],
  templateUrl: './component-editor.html',
  styleUrl: '../register-form.scss',
})
export class ComponentEditor {
  private readonly api = inject(InstallRegisterApi);

  /** The system the register belongs to. */
  readonly systemId = input.required<string>();
  /** The component being edited; null adds a new one. */
  readonly editing = input<RegisterComponent | null>(null);
  /** Emitted with the stored component. */
  readonly saved = output<RegisterComponent>();
  /** Emitted when the person gives up the edit. */
  readonly cancelled = output<void>();

  protected readonly form = componentForm();
  protected readonly kind = toSignal(this.form.controls.kind.valueChanges, {
    initialValue: this.form.controls.kind.value,
  });
  protected readonly draw = toSignal(this.form.controls.draw.valueChanges, {
    initialValue: this.form.controls.draw.value,
  });
  protected readonly saving = signal(false);
  protected readonly problem = signal<string | null>(null);

  constructor() {
    effect(() => {
      const editing = this.editing();
      untracked(() => (editing ? fillComponentForm(this.form, editing) : this.resetForm()));
    });
    this.form.controls.kind.valueChanges.subscribe((kind) => showKind(this.form, kind));
    this.form.controls.draw.valueChanges.subscribe(() => showKind(this.form, this.form.controls.kind.value));
  }

  protected save(): void {
    saveWithFieldErrors(
      this.form,
      { saving: this.saving, problem: this.problem },
      {
        request: () =>
          this.api.saveComponent(this.systemId(), readComponentForm(this.form), this.editing()?.id),
        // The server names the field (`ratings.capacityAh`): show its words under that control when there is one.
        controlFor: (field) => {
          const name = field.replace(/^ratings\./, '');
          return RENAMED[name] ?? name;
        },
        saved: (component) => {
          this.resetForm();
          this.saved.emit(component);
        },
      },
    );
  }

  protected cancel(): void {
    this.resetForm();
    this.cancelled.emit();
  }

  protected errorOf(name: string, label: string): string | null {
    return fieldError(
      this.form,
      name,
      label,
      'lower-case letters, digits and dashes, as the monitor reports it',
    );
  }

  protected readonly kinds: { value: ComponentKind; label: string }[] = [
    { value: 'battery', label: 'Battery and BMS' },
    { value: 'charge-source', label: 'Charge source' },
    { value: 'inverter', label: 'Inverter' },
    { value: 'heater', label: 'Heater' },
    { value: 'fridge', label: 'Fridge' },
    { value: 'load', label: 'Other load' },
  ];

  private resetForm(): void {
    this.form.reset();
    showKind(this.form, this.form.controls.kind.value);
  }
}
