import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import {
  AbstractControl,
  FormControl,
  FormGroup,
  ReactiveFormsModule,
  ValidationErrors,
  Validators,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { AlertEvent } from '@cellwarden/shared';
import { AlertsApi } from '../../core/alerts-api';
import { apiProblem } from '../../core/api-error';

/** Longest note the server accepts. */
export const MAX_NOTE_LENGTH = 500;

/** What the dialog acknowledges. */
export interface AcknowledgeData {
  systemId: string;
  alert: AlertEvent;
  title: string;
}

/** Acknowledges one alert with a note on what was done; closes with the updated alert. */
@Component({
  selector: 'cw-acknowledge-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './acknowledge-dialog.html',
  styles: `
    .note {
      width: 100%;
    }
    .problem {
      color: var(--mat-sys-error);
    }
  `,
})
export class AcknowledgeDialog {
  private readonly api = inject(AlertsApi);
  private readonly dialogRef = inject<MatDialogRef<AcknowledgeDialog, AlertEvent>>(MatDialogRef);
  protected readonly data = inject<AcknowledgeData>(MAT_DIALOG_DATA);

  protected readonly maxLength = MAX_NOTE_LENGTH;
  protected readonly note = new FormControl('', {
    nonNullable: true,
    validators: [Validators.required, Validators.maxLength(MAX_NOTE_LENGTH), notBlank],
  });
  protected readonly form = new FormGroup({ note: this.note });
  protected readonly saving = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected acknowledge(): void {
    this.note.markAsTouched();
    if (this.note.invalid || this.saving()) return;
    this.saving.set(true);
    this.problem.set(null);
    this.api.acknowledge(this.data.systemId, this.data.alert.id, this.note.value.trim()).subscribe({
      next: (alert) => this.dialogRef.close(alert),
      error: (error: unknown) => this.showProblem(error),
    });
  }

  private showProblem(error: unknown): void {
    const problem = apiProblem(error);
    this.saving.set(false);
    if (problem.field === 'note') this.note.setErrors({ server: problem.message });
    else this.problem.set(problem.message);
  }
}

// Validators.required lets a note of only spaces through.
function notBlank(control: AbstractControl<string>): ValidationErrors | null {
  return control.value && control.value.trim() === '' ? { required: true } : null;
}
