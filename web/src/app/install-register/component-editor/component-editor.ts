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
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { ComponentKind, RegisterComponent } from '@cellwarden/shared';
import { apiProblem } from '../../core/api-error';
import { InstallRegisterApi } from '../install-register-api';
import { componentForm, fillComponentForm, readComponentForm, showKind } from '../component-form-model';

// Fields the form asks for in per cent, under another name than the API's.
const RENAMED: Record<string, string> = { efficiency: 'efficiencyPercent', dutyCycle: 'dutyPercent' };

/** Adds a component to the register, or edits the one given. */
@Component({
  selector: 'cw-component-editor',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatCheckboxModule,
    MatButtonModule,
  ],
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
    this.form.markAllAsTouched();
    if (this.form.invalid || this.saving()) return;
    this.saving.set(true);
    this.problem.set(null);
    this.api.saveComponent(this.systemId(), readComponentForm(this.form), this.editing()?.id).subscribe({
      next: (component) => {
        this.saving.set(false);
        this.resetForm();
        this.saved.emit(component);
      },
      error: (error: unknown) => {
        this.saving.set(false);
        const problem = apiProblem(error);
        // The server names the field (`ratings.capacityAh`): show its words under that control when there is one.
        const field = problem.field?.replace(/^ratings\./, '');
        const control = field ? this.form.get(RENAMED[field] ?? field) : null;
        if (control) {
          control.setErrors({ server: problem.message });
          control.markAsTouched();
        }
        this.problem.set(problem.message);
      },
    });
  }

  protected cancel(): void {
    this.resetForm();
    this.cancelled.emit();
  }

  protected errorOf(name: string, label: string): string | null {
    const control = this.form.get(name);
    if (!control || !control.touched || control.valid) return null;
    if (control.hasError('server')) return control.getError('server');
    if (control.hasError('required')) return `${label} is required.`;
    if (control.hasError('min')) return `${label} must be at least ${control.getError('min').min}.`;
    if (control.hasError('max')) return `${label} must be at most ${control.getError('max').max}.`;
    if (control.hasError('pattern'))
      return `${label}: lower-case letters, digits and dashes, as the monitor reports it.`;
    if (control.hasError('maxlength')) return `${label} is too long.`;
    return `${label} is not valid.`;
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
