import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatTabsModule } from '@angular/material/tabs';
import { EnergyBudgetEditor } from './energy-budget/energy-budget';
import { WireFuse } from './wire-fuse/wire-fuse';

/** Route installer: the calculators an installer uses before and while fitting a system. */
@Component({
  selector: 'cw-installer',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatTabsModule, WireFuse, EnergyBudgetEditor],
  template: `
    <h1>Installer tools</h1>
    <p class="note">
      Planning aids. Wire, fuse and charging choices follow local codes, the manufacturers' instructions and
      licensed practice; Cellwarden monitors and never replaces a BMS.
    </p>
    <mat-tab-group mat-stretch-tabs="false" dynamicHeight>
      <mat-tab label="Wire & fuse"
        ><ng-template matTabContent><cw-wire-fuse /></ng-template
      ></mat-tab>
      <mat-tab label="Energy budget"
        ><ng-template matTabContent><cw-energy-budget /></ng-template
      ></mat-tab>
    </mat-tab-group>
  `,
  styles: `
    .note {
      color: var(--mat-sys-on-surface-variant);
    }
    mat-tab-group {
      margin-top: 8px;
    }
  `,
})
export class Installer {}
