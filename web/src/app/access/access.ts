import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink } from '@angular/router';
import { Audit } from './audit/audit';
import { Devices } from './devices/devices';
import { Grants } from './grants/grants';
import { SystemRequests } from './system-requests/system-requests';

/** Route systems/:id/access: the owner manages who sees the system, its devices, and reads the audit. */
@Component({
  selector: 'cw-access',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    MatTabsModule,
    MatButtonModule,
    MatIconModule,
    RouterLink,
    Grants,
    Devices,
    Audit,
    SystemRequests,
  ],
  template: `
    <a mat-button [routerLink]="['/systems', id()]"><mat-icon>arrow_back</mat-icon> Back to the system</a>
    <h1>Access and devices</h1>
    <mat-tab-group mat-stretch-tabs="false" dynamicHeight>
      <mat-tab label="Grants"
        ><ng-template matTabContent><cw-grants [systemId]="id()" /></ng-template
      ></mat-tab>
      <mat-tab label="Requests"
        ><ng-template matTabContent><cw-system-requests [systemId]="id()" /></ng-template
      ></mat-tab>
      <mat-tab label="Devices"
        ><ng-template matTabContent><cw-devices [systemId]="id()" /></ng-template
      ></mat-tab>
      <mat-tab label="Audit trail"
        ><ng-template matTabContent><cw-audit [systemId]="id()" /></ng-template
      ></mat-tab>
    </mat-tab-group>
  `,
})
export class Access {
  /** The system id from the route. */
  readonly id = input.required<string>();
}
