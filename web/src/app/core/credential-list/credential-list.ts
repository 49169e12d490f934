import { ClipboardModule } from '@angular/cdk/clipboard';
import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

/** One value of a device's credentials, under the name the screen gives it. */
export interface CredentialRow {
  label: string;
  value: string;
}

/**
 * A device's MQTT credentials the one time the server sends them (the devices dialog, the onboarding monitor
 * step): the projected warning that the secret is shown only now, then each value with a copy button. Copies
 * are reported through `copied`, so the screen announces them in its own live region.
 */
@Component({
  selector: 'cw-credential-list',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ClipboardModule, MatButtonModule, MatIconModule],
  template: `
    <p class="once" [attr.role]="warningRole()">
      <mat-icon aria-hidden="true">key</mat-icon>
      <span><ng-content /></span>
    </p>
    <dl class="credentials">
      @for (row of rows(); track row.label) {
        <div class="row">
          <dt>{{ row.label }}</dt>
          <dd>
            <code>{{ row.value }}</code>
            <button
              mat-icon-button
              type="button"
              [cdkCopyToClipboard]="row.value"
              (cdkCopyToClipboardCopied)="copied.emit($event ? row.label : null)"
              [attr.aria-label]="'Copy ' + row.label"
            >
              <mat-icon>content_copy</mat-icon>
            </button>
          </dd>
        </div>
      }
    </dl>
  `,
  styles: `
    :host {
      display: block;
    }
    .once {
      display: flex;
      gap: 8px;
      align-items: flex-start;
      padding: 12px;
      border-radius: 12px;
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
    }
    .credentials {
      margin: 0;
    }
    .row {
      margin-bottom: 8px;
    }
    dt {
      font: var(--mat-sys-label-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    dd {
      margin: 0;
      display: flex;
      align-items: center;
      gap: 4px;
    }
    code {
      overflow-wrap: anywhere;
      flex: 1;
    }
  `,
})
export class CredentialList {
  /** The values to show, in order. */
  readonly rows = input.required<readonly CredentialRow[]>();
  /** `alert` where the credentials appear unasked (a dialog opening), `note` where they are part of a page. */
  readonly warningRole = input<'alert' | 'note'>('note');
  /** Emitted with a row's label once its value is on the clipboard, or null when copying failed. */
  readonly copied = output<string | null>();
}
