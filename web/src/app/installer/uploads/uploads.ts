import { DatePipe } from '@angular/common';
import { HttpEventType } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSelectModule } from '@angular/material/select';
import type { UploadListing } from '@cellwarden/shared';
import { combineLatest, switchMap } from 'rxjs';
import { LoadState, toLoadState } from '../../core/load-state';
import { serverErrorOf } from '../../core/api-error';
import { InstallerApi } from '../installer-api';
import { UPLOAD_TYPES, formatBytes, uploadProblem } from './upload-rules';

/** Photos and logs of a system: pick a file, caption it, upload with progress, and the list so far. */
@Component({
  selector: 'cw-uploads',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    MatListModule,
    MatProgressBarModule,
    MatProgressSpinnerModule,
    DatePipe,
  ],
  templateUrl: './uploads.html',
  styleUrl: './uploads.scss',
})
export class Uploads {
  private readonly api = inject(InstallerApi);

  /** The system the files belong to. */
  readonly systemId = input.required<string>();

  private readonly reloads = signal(0);
  protected readonly accept = Object.keys(UPLOAD_TYPES).join(',');
  protected readonly formatBytes = formatBytes;
  protected readonly list = toSignal(
    combineLatest([toObservable(this.systemId), toObservable(this.reloads)]).pipe(
      switchMap(([id]) => toLoadState(this.api.uploads(id), 'The uploads could not be loaded.')),
    ),
    { initialValue: { status: 'loading' } as LoadState<UploadListing[]> },
  );
  protected readonly form = inject(FormBuilder).nonNullable.group({
    caption: ['', [Validators.maxLength(200)]],
    kind: ['photo' as UploadListing['kind'], Validators.required],
  });
  protected readonly file = signal<File | null>(null);
  protected readonly fileError = signal<string | null>(null);
  protected readonly progress = signal<number | null>(null);
  protected readonly serverError = signal<string | null>(null);
  protected readonly done = signal<string | null>(null);

  protected chooseFile(event: Event): void {
    const file = (event.target as HTMLInputElement).files?.[0] ?? null;
    this.done.set(null);
    this.file.set(file);
    this.fileError.set(file ? uploadProblem(file) : null);
    if (file && !this.fileError()) this.form.controls.kind.setValue(UPLOAD_TYPES[file.type]);
  }

  protected uploadFile(): void {
    const file = this.file();
    this.serverError.set(null);
    if (!file) {
      this.fileError.set('File: choose a photo or a log to upload.');
      return;
    }
    if (this.fileError() || this.form.invalid) return;
    const { caption, kind } = this.form.getRawValue();
    this.progress.set(0);
    this.api.upload(this.systemId(), file, caption.trim(), kind).subscribe({
      next: (event) => {
        if (event.type === HttpEventType.UploadProgress && event.total) {
          this.progress.set(Math.round((100 * event.loaded) / event.total));
        } else if (event.type === HttpEventType.Response) {
          this.finish(file.name);
        }
      },
      error: (error: unknown) => {
        this.progress.set(null);
        this.serverError.set(serverErrorOf(error, `${file.name} could not be uploaded.`).message);
      },
    });
  }

  private finish(name: string): void {
    this.progress.set(null);
    this.file.set(null);
    this.form.reset();
    this.done.set(`${name} uploaded.`);
    this.reloads.update((n) => n + 1);
  }
}
