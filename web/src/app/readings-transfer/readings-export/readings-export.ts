import { HttpEventType } from '@angular/common/http';
import {
  ChangeDetectionStrategy,
  Component,
  LOCALE_ID,
  computed,
  inject,
  input,
  signal,
} from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Subscription } from 'rxjs';
import { DateTimePipe } from '../../core/date-time-pipe';
import {
  PRESET_LABELS,
  PRESET_SPANS,
  type RangePreset,
  fromLocalInput,
  rangeProblem,
  toLocalInput,
} from '../../core/time-range';
import { saveBlob } from '../../core/blob-files';
import { formatByteCount } from '../byte-count';
import { ReadingsTransferApi } from '../readings-transfer-api';
import { transferProblem } from '../../core/api-error';

const PRESETS: RangePreset[] = ['1h', '24h', '7d', '30d'];

/** What the download is doing: idle, receiving (bytes so far, total when the server sent a length), done or failed. */
type DownloadState =
  | { phase: 'idle' }
  | { phase: 'receiving'; loaded: number; total: number | null }
  | { phase: 'saved'; fileName: string; bytes: number }
  | { phase: 'failed'; message: string };

/** Chooses a range of raw readings and downloads it as a CSV file, showing the bytes received as they come. */
@Component({
  selector: 'cw-readings-export',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    FormsModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressBarModule,
    DateTimePipe,
  ],
  templateUrl: './readings-export.html',
  styleUrl: '../readings-transfer.scss',
})
export class ReadingsExport {
  private readonly api = inject(ReadingsTransferApi);
  private readonly locale = inject(LOCALE_ID);

  /** The system whose readings are exported. */
  readonly systemId = input.required<string>();

  protected readonly presets = PRESETS.map((preset) => ({ preset, label: PRESET_LABELS[preset].long }));
  protected readonly choice = signal<RangePreset | 'custom'>('24h');
  protected readonly customFrom = signal(toLocalInput(Date.now() - PRESET_SPANS['24h']));
  protected readonly customTo = signal(toLocalInput(Date.now()));
  protected readonly download = signal<DownloadState>({ phase: 'idle' });
  protected readonly customProblem = computed(() =>
    this.choice() === 'custom'
      ? rangeProblem({ from: fromLocalInput(this.customFrom()), to: fromLocalInput(this.customTo()) })
      : null,
  );
  /** The range as it will be asked for, for the line under the picker (a preset ends at the moment of choosing). */
  protected readonly shownRange = computed(() => {
    const choice = this.choice();
    if (choice !== 'custom') return { from: Date.now() - PRESET_SPANS[choice], to: Date.now() };
    return this.customProblem()
      ? null
      : { from: fromLocalInput(this.customFrom()), to: fromLocalInput(this.customTo()) };
  });
  protected readonly progressText = computed(() => {
    const state = this.download();
    if (state.phase !== 'receiving') return '';
    const loaded = formatByteCount(state.loaded, this.locale);
    return state.total
      ? `${loaded} of ${formatByteCount(state.total, this.locale)} received`
      : `${loaded} received`;
  });
  protected readonly bytes = (count: number) => formatByteCount(count, this.locale);
  private running: Subscription | null = null;

  /** Starts the download of the chosen range; a preset ends now. */
  protected startDownload(): void {
    const range = this.chosenRange();
    if (!range) return;
    this.running?.unsubscribe();
    this.download.set({ phase: 'receiving', loaded: 0, total: null });
    const fileName = `cellwarden-readings-${new Date(range.from).toISOString().slice(0, 16).replace(':', '')}Z.csv`;
    this.running = this.api.exportCsv(this.systemId(), new Date(range.from), new Date(range.to)).subscribe({
      next: (event) => {
        if (event.type === HttpEventType.DownloadProgress)
          this.download.set({ phase: 'receiving', loaded: event.loaded, total: event.total ?? null });
        else if (event.type === HttpEventType.Response && event.body) {
          saveBlob(event.body, fileName);
          this.download.set({ phase: 'saved', fileName, bytes: event.body.size });
        }
      },
      error: async (error: unknown) =>
        this.download.set({ phase: 'failed', message: (await transferProblem(error)).message }),
    });
  }

  /** Stops a download under way; nothing is saved. */
  protected cancelDownload(): void {
    this.running?.unsubscribe();
    this.running = null;
    this.download.set({ phase: 'idle' });
  }

  private chosenRange(): { from: number; to: number } | null {
    const choice = this.choice();
    if (choice !== 'custom') {
      const to = Date.now();
      return { from: to - PRESET_SPANS[choice], to };
    }
    if (this.customProblem()) return null;
    return { from: fromLocalInput(this.customFrom()), to: fromLocalInput(this.customTo()) };
  }
}
