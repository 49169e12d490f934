import { ClipboardModule } from '@angular/cdk/clipboard';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import type { DeviceCredentials } from '@cellwarden/shared';

/** Shows a device's MQTT credentials the one time the server sends them, with copy buttons. */
@Component({
  selector: 'cw-device-credentials',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatDialogModule, MatButtonModule, MatIconModule, ClipboardModule],
  templateUrl: './device-credentials.html',
  styleUrl: './device-credentials.scss',
})
export class DeviceCredentialsDialog {
  protected readonly credentials = inject<DeviceCredentials>(MAT_DIALOG_DATA);
  protected readonly copied = signal<string | null>(null);

  protected readonly rows = [
    { label: 'Broker URL', value: this.credentials.brokerUrl },
    { label: 'MQTT username', value: this.credentials.mqttUsername },
    { label: 'MQTT password', value: this.credentials.mqttPassword },
    { label: 'Topic to publish to', value: this.credentials.mqttTopic },
    { label: 'Broker port', value: String(this.credentials.brokerPort) },
  ];

  protected markCopied(label: string, done: boolean): void {
    this.copied.set(done ? label : null);
  }
}
