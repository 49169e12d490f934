import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  effect,
  input,
  output,
  viewChild,
} from '@angular/core';
import {
  AbstractControl,
  FormControl,
  FormGroup,
  ReactiveFormsModule,
  ValidationErrors,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { TimeRange, fromLocalInput, rangeProblem, toLocalInput } from '../../core/time-range';

/** The range of a from/to pair, checked by `rangeProblem`. */
function rangeValidator(group: AbstractControl): ValidationErrors | null {
  const { from, to } = group.value as { from: string; to: string };
  const problem = rangeProblem({ from: fromLocalInput(from), to: fromLocalInput(to) });
  return problem ? { range: problem } : null;
}

/** A from/to pair of local date-times to choose any range; the keyboard way to zoom. */
@Component({
  selector: 'cw-custom-range',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule],
  template: `
    <form [formGroup]="form" (ngSubmit)="applyRange()" class="custom" aria-label="Custom range">
      <mat-form-field appearance="outline" subscriptSizing="dynamic">
        <mat-label>From</mat-label>
        <input matInput type="datetime-local" formControlName="from" required #fromInput />
      </mat-form-field>
      <mat-form-field appearance="outline" subscriptSizing="dynamic">
        <mat-label>To</mat-label>
        <input matInput type="datetime-local" formControlName="to" required />
      </mat-form-field>
      <button mat-flat-button type="submit">Show range</button>
      @if (form.errors?.['range'] && form.touched) {
        <p class="problem" role="alert">{{ form.errors?.['range'] }}</p>
      }
    </form>
  `,
  styles: `
    .custom {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px;
    }
    .problem {
      flex-basis: 100%;
      margin: 0;
      color: var(--mat-sys-error);
    }
  `,
})
export class CustomRange {
  /** The range shown now, to start from. */
  readonly range = input.required<TimeRange>();
  /** Emits a valid range when the person applies it. */
  readonly apply = output<TimeRange>();

  protected readonly form = new FormGroup(
    {
      from: new FormControl('', { nonNullable: true }),
      to: new FormControl('', { nonNullable: true }),
    },
    { validators: rangeValidator },
  );

  private readonly fromInput = viewChild<ElementRef<HTMLInputElement>>('fromInput');

  constructor() {
    effect(() => this.prefill(this.range()));
  }

  /** Puts the keyboard in the start field, for the picker's "Custom" choice. */
  focusStart(): void {
    this.fromInput()?.nativeElement.focus();
  }

  protected applyRange(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const { from, to } = this.form.getRawValue();
    this.apply.emit({ from: fromLocalInput(from), to: fromLocalInput(to) });
  }

  private prefill(range: TimeRange): void {
    this.form.setValue({ from: toLocalInput(range.from), to: toLocalInput(range.to) });
    this.form.markAsUntouched();
  }
}
