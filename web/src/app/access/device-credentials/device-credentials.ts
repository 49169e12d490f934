import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import type { DeviceCredentials } from '@cellwarden/shared';
import { CredentialList, type CredentialRow } from '../../core/credential-list/credential-list';

/** Shows a device's MQTT credentials the one time the server sends them, with copy buttons. */
@Component({
  selector: 'cw-device-credentials',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatDialogModule, MatButtonModule, CredentialList],
  templateUrl: './device-credentials.html',
})
export class DeviceCredentialsDialog {
  protected readonly credentials = inject<DeviceCredentials>(MAT_DIALOG_DATA);
  protected readonly copied = signal<string | null>(null);

  protected readonly rows: CredentialRow[] = [
    { label: 'Broker URL', value: this.credentials.brokerUrl },
    { label: 'MQTT username', value: this.credentials.mqttUsername },
    { label: 'MQTT password', value: this.credentials.mqttPassword },
    { label: 'Topic to publish to', value: this.credentials.mqttTopic },
    { label: 'Broker port', value: String(this.credentials.brokerPort) },
  ];
}
