import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatTableModule } from '@angular/material/table';
import type { AuditEntry } from '@cellwarden/shared';
import { switchMap } from 'rxjs';
import { AccessApi } from '../../core/access-api';
import { LoadState, loadedOr, toLoadState } from '../../core/load-state';
import { auditActionLabel } from './audit-action-label';

/** The system's audit trail as a paginated table (the contract sends all entries; pages are cut here). */
@Component({
  selector: 'cw-audit',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatTableModule, MatPaginatorModule, MatProgressSpinnerModule, DatePipe],
  templateUrl: './audit.html',
  styleUrl: '../access-tables.scss',
})
export class Audit {
  private readonly api = inject(AccessApi);

  /** The system whose audit trail this is. */
  readonly systemId = input.required<string>();

  protected readonly columns = ['at', 'actor', 'action', 'detail'];
  protected readonly actionLabel = auditActionLabel;
  protected readonly state = toSignal(
    toObservable(this.systemId).pipe(
      switchMap((id) => toLoadState(this.api.audit(id), 'The audit trail could not be loaded.')),
    ),
    { initialValue: { status: 'loading' } as LoadState<AuditEntry[]> },
  );
  protected readonly page = signal({ index: 0, size: 25 });
  protected readonly entries = computed(() => loadedOr(this.state(), []));
  protected readonly pageEntries = computed(() => {
    const { index, size } = this.page();
    return this.entries().slice(index * size, (index + 1) * size);
  });

  protected turnPage(event: PageEvent): void {
    this.page.set({ index: event.pageIndex, size: event.pageSize });
  }
}
