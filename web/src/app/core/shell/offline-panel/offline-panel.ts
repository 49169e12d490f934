import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { OfflineStore } from '../../offline/offline-store';

/**
 * Shown while the browser is offline: the last values of each system, labelled with the time they are from,
 * set apart from the live screens so nothing old reads as live.
 */
@Component({
  selector: 'cw-offline-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe, DecimalPipe, MatIconModule],
  templateUrl: './offline-panel.html',
  styleUrl: './offline-panel.scss',
})
export class OfflinePanel {
  protected readonly store = inject(OfflineStore);
  protected readonly copy = this.store.copy;
  protected readonly hasValues = computed(() => this.copy().systems.length > 0);
}
