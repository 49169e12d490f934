import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

/** A numeric threshold with its chemistry default shown beside it and a way back to that default. */
@Component({
  selector: 'cw-threshold-field',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatButtonModule,
    MatIconModule,
    DecimalPipe,
  ],
  template: `
    <mat-form-field appearance="outline">
      <mat-label>{{ label() }} ({{ unit() }})</mat-label>
      <input matInput type="number" [step]="step()" [formControl]="control()" />
      @if (defaultValue() != null) {
        <!-- A no-break space keeps the unit (°C) with its number on a phone. -->
        <mat-hint>Default {{ defaultValue()! | number: '1.0-1' }}&nbsp;{{ unit() }}</mat-hint>
      }
      @if (control().hasError('required')) {
        <mat-error>Enter a value.</mat-error>
      } @else if (
        control().hasError('min') || control().hasError('max') || control().hasError('temperatureRange')
      ) {
        <mat-error>{{ rangeText() }}</mat-error>
      } @else if (control().hasError('server')) {
        <mat-error>{{ control().getError('server') }}</mat-error>
      }
    </mat-form-field>
    @if (defaultValue() != null && control().enabled) {
      <button
        mat-button
        type="button"
        [disabled]="readOnly() || control().value === defaultValue()"
        (click)="resetToDefault()"
        [attr.aria-label]="'Reset ' + label() + ' to the default'"
      >
        <mat-icon aria-hidden="true">restart_alt</mat-icon>Default
      </button>
    }
  `,
  styles: `
    :host {
      display: flex;
      align-items: flex-start;
      gap: 4px;
      flex-wrap: wrap;
    }
    mat-form-field {
      flex: 1 1 220px;
    }
    button {
      margin-top: 8px;
    }
  `,
})
export class ThresholdField {
  /** The control holding the value. */
  readonly control = input.required<FormControl<number | null>>();
  /** The person may not change this value. */
  readonly readOnly = input(false);
  /** What the threshold is called. */
  readonly label = input.required<string>();
  /** The unit it is entered in. */
  readonly unit = input.required<string>();
  /** The chemistry default, in the same unit; null hides the reset. */
  readonly defaultValue = input<number | null>(null);
  /** The allowed range in words, shown when the value is outside it. */
  readonly rangeText = input('The value is outside the allowed range.');
  /** The input's step. */
  readonly step = input(1);

  protected resetToDefault(): void {
    this.control().setValue(this.defaultValue());
    this.control().markAsDirty();
  }
}
