import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { SystemNav } from '../core/system-nav/system-nav';
import { ReadingsExport } from './readings-export/readings-export';
import { ReadingsImport } from './readings-import/readings-import';

/**
 * Route systems/:id/readings-transfer: the readings as a CSV file, out and in. Everyone who sees the system may
 * export; importing needs configure access, which the server decides and the import explains when refused.
 */
@Component({
  selector: 'cw-readings-transfer',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [SystemNav, ReadingsExport, ReadingsImport],
  template: `
    <cw-system-nav [systemId]="id()" active="readings-transfer" />
    <h1>Readings as CSV</h1>
    <cw-readings-export [systemId]="id()" />
    <cw-readings-import [systemId]="id()" />
  `,
})
export class ReadingsTransfer {
  /** The system id from the route. */
  readonly id = input.required<string>();
}
