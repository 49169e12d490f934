import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { InstallerVerdict } from '@cellwarden/shared';

const ICONS = { error: 'error', warning: 'warning', info: 'info' } as const;

/** An installer verdict: pass/fail headline and each finding with its severity. */
@Component({
  selector: 'cw-findings',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `
    <p class="headline" [class.ok]="verdict().ok" [class.not-ok]="!verdict().ok" role="status">
      <mat-icon aria-hidden="true">{{ verdict().ok ? 'check_circle' : 'cancel' }}</mat-icon>
      {{ verdict().ok ? passText() : failText() }}
    </p>
    @if (verdict().findings.length) {
      <ul class="findings" aria-label="Reasons">
        @for (finding of verdict().findings; track finding.code + finding.message) {
          <li [class]="finding.severity">
            <mat-icon aria-hidden="true">{{ icons[finding.severity] }}</mat-icon>
            <span
              ><span class="cw-visually-hidden">{{ finding.severity }}: </span>{{ finding.message }}</span
            >
          </li>
        }
      </ul>
    }
  `,
  styleUrl: './findings.scss',
})
export class Findings {
  /** The verdict to show. */
  readonly verdict = input.required<InstallerVerdict>();
  /** Headline when nothing failed. */
  readonly passText = input('Passes');
  /** Headline when a finding is an error. */
  readonly failText = input('Does not pass');

  protected readonly icons = ICONS;
}
