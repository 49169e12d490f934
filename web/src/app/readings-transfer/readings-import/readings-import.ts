import { DecimalPipe } from '@angular/common';
import { HttpEventType } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, LOCALE_ID, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { Subscription } from 'rxjs';
import { DateTimePipe } from '../../core/date-time-pipe';
import { TemperaturePipe } from '../../core/temperature-pipe';
import { formatByteCount } from '../byte-count';
import { CsvPreview, previewReadingsCsv } from '../csv-preview';
import { ReadingsImportResult, ReadingsTransferApi } from '../readings-transfer-api';
import { transferProblem } from '../../core/api-error';
import { blobText } from '../../core/blob-files';
import { importProblemText } from '../import-problem-text';

/** Largest file the server takes (16 MiB, server/src/telemetry/readings-csv-reader.ts). */
export const IMPORT_LIMIT_BYTES = 16 * 1024 * 1024;
/** Rows shown before the upload. */
export const PREVIEW_ROWS = 10;
// Enough of the file's start for the header and the preview rows (a row is under 100 bytes in our format).
const PREVIEW_BYTES = 64 * 1024;

type UploadState =
  | { phase: 'idle' }
  | { phase: 'sending'; sent: number; total: number }
  | { phase: 'storing' }
  | { phase: 'stored'; result: ReadingsImportResult }
  | { phase: 'refused'; message: string };

/** Chooses a CSV file, previews its first rows in the browser, uploads it, and says what was stored: all or nothing. */
@Component({
  selector: 'cw-readings-import',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    DecimalPipe,
    MatButtonModule,
    MatProgressBarModule,
    MatTableModule,
    DateTimePipe,
    TemperaturePipe,
  ],
  templateUrl: './readings-import.html',
  styleUrl: '../readings-transfer.scss',
})
export class ReadingsImport {
  private readonly api = inject(ReadingsTransferApi);
  private readonly locale = inject(LOCALE_ID);

  /** The system the readings are stored in. */
  readonly systemId = input.required<string>();

  protected readonly file = signal<File | null>(null);
  protected readonly fileProblem = signal<string | null>(null);
  protected readonly preview = signal<CsvPreview | null>(null);
  protected readonly upload = signal<UploadState>({ phase: 'idle' });
  protected readonly columns = ['line', 'measuredAt', 'voltage', 'current', 'temperature', 'stateOfCharge'];
  protected readonly bytes = (count: number) => formatByteCount(count, this.locale);
  private running: Subscription | null = null;

  /** Reads the chosen file's start and previews it; nothing is sent yet. */
  protected async chooseFile(input: HTMLInputElement): Promise<void> {
    this.running?.unsubscribe();
    this.upload.set({ phase: 'idle' });
    this.preview.set(null);
    const file = input.files?.[0] ?? null;
    this.file.set(file);
    this.fileProblem.set(null);
    if (!file) return;
    if (file.size > IMPORT_LIMIT_BYTES) {
      this.fileProblem.set(
        `The file is ${this.bytes(file.size)}; an import takes at most 16 MiB. Split it by date.`,
      );
      return;
    }
    const start = await blobText(file.slice(0, PREVIEW_BYTES));
    const preview = previewReadingsCsv(start, PREVIEW_ROWS, Date.now());
    if (preview.headerProblem) this.fileProblem.set(preview.headerProblem);
    this.preview.set(preview);
  }

  /** Uploads the whole file; the server stores every row or, at the first bad one, none. */
  protected importFile(): void {
    const file = this.file();
    if (!file || this.fileProblem()) return;
    this.upload.set({ phase: 'sending', sent: 0, total: file.size });
    this.running = this.api.importCsv(this.systemId(), file).subscribe({
      next: (event) => {
        if (event.type === HttpEventType.UploadProgress) {
          const total = event.total ?? file.size;
          this.upload.set(
            event.loaded >= total ? { phase: 'storing' } : { phase: 'sending', sent: event.loaded, total },
          );
        } else if (event.type === HttpEventType.Response && event.body)
          this.upload.set({ phase: 'stored', result: event.body.import });
      },
      error: async (error: unknown) =>
        this.upload.set({ phase: 'refused', message: importProblemText(await transferProblem(error)) }),
    });
  }

  protected isRowProblem(row: object): row is { line: number; column: string; problem: string } {
    return 'problem' in row;
  }
}
