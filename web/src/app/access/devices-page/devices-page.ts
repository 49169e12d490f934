import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { SystemNav } from '../../core/system-nav/system-nav';
import { Devices } from '../devices/devices';

/**
 * Route systems/:id/devices: the system's monitors for everyone the access rule lets manage them (its owner
 * and the installers of its company), not only from the owner's Access page.
 */
@Component({
  selector: 'cw-devices-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [SystemNav, Devices],
  template: `
    <cw-system-nav [systemId]="id()" active="devices" />
    <h1>Device management</h1>
    <cw-devices [systemId]="id()" />
  `,
})
export class DevicesPage {
  /** The system id from the route. */
  readonly id = input.required<string>();
}
