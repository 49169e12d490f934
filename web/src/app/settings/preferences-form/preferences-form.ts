import { ChangeDetectionStrategy, Component, effect, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatRadioModule } from '@angular/material/radio';
import type { FlagKind, UserPreferences } from '@cellwarden/shared';
import { apiProblem } from '../../core/api-error';
import { FLAG_KINDS, flagText } from '../../core/flag-text';
import { Preferences } from '../../core/preferences';
import type { TemperatureUnit } from '../../core/temperature-unit';

/** The person's own preferences: temperature unit and which flags they get e-mail about. */
@Component({
  selector: 'cw-preferences-form',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatRadioModule, MatCheckboxModule, MatButtonModule],
  templateUrl: './preferences-form.html',
  styleUrl: './preferences-form.scss',
})
export class PreferencesForm {
  private readonly preferences = inject(Preferences);

  protected readonly flags = FLAG_KINDS.map((kind) => ({ kind, title: flagText(kind).title }));
  protected readonly form = new FormGroup({
    temperatureUnit: new FormControl<TemperatureUnit>('C', { nonNullable: true }),
    emailFlags: new FormGroup(
      Object.fromEntries(FLAG_KINDS.map((k) => [k, new FormControl(false, { nonNullable: true })])) as Record<
        FlagKind,
        FormControl<boolean>
      >,
    ),
  });
  protected readonly saving = signal(false);
  protected readonly message = signal<{ kind: 'saved' | 'error'; text: string } | null>(null);

  constructor() {
    effect(() => this.fill(this.preferences.value()));
  }

  protected save(): void {
    const value = this.form.getRawValue();
    const preferences: UserPreferences = {
      temperatureUnit: value.temperatureUnit,
      emailFlags: FLAG_KINDS.filter((k) => value.emailFlags[k]),
    };
    this.saving.set(true);
    this.message.set(null);
    this.preferences.save(preferences).subscribe({
      next: () => this.done({ kind: 'saved', text: 'Your preferences are saved.' }),
      error: (error: unknown) => this.done({ kind: 'error', text: apiProblem(error).message }),
    });
  }

  private done(message: { kind: 'saved' | 'error'; text: string }): void {
    this.saving.set(false);
    this.message.set(message);
  }

  private fill(preferences: UserPreferences | null): void {
    if (!preferences || this.form.dirty) return;
    const emailFlags = Object.fromEntries(FLAG_KINDS.map((k) => [k, preferences.emailFlags.includes(k)]));
    this.form.reset({ temperatureUnit: preferences.temperatureUnit, emailFlags });
  }
}
