import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { Role } from '@cellwarden/shared';
import { Auth } from '../auth';

/** The sections of one system's pages. */
export type SystemSection =
  | 'live'
  | 'history'
  | 'alerts'
  | 'battery-health'
  | 'settings'
  | 'readings-transfer'
  | 'devices'
  | 'access'
  | 'commissioning'
  | 'install';

/** Links between one system's live, history, alerts and settings pages, with a way back to the list. */
@Component({
  selector: 'cw-system-nav',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule, RouterLink],
  template: `
    <a class="back" routerLink="/systems"><mat-icon aria-hidden="true">arrow_back</mat-icon>All systems</a>
    <nav [attr.aria-label]="'Pages of ' + (name() || 'this system')">
      @for (link of visibleLinks(); track link.section) {
        <a
          [routerLink]="link.path(systemId())"
          [class.active]="active() === link.section"
          [attr.aria-current]="active() === link.section ? 'page' : null"
          ><mat-icon aria-hidden="true">{{ link.icon }}</mat-icon
          >{{ link.label }}</a
        >
      }
    </nav>
  `,
  styles: `
    :host {
      display: block;
      margin-bottom: 12px;
    }
    nav {
      display: flex;
      overflow-x: auto;
      gap: 4px;
      margin-top: 8px;
      padding: 4px;
      border-radius: 24px;
      background: var(--mat-sys-surface-container);
      width: fit-content;
      max-width: 100%;
      box-sizing: border-box;
    }
    nav a {
      display: inline-flex;
      align-items: center;
      gap: 6px;
      min-height: 40px;
      padding: 0 14px;
      border-radius: 20px;
      color: var(--mat-sys-on-surface-variant);
      text-decoration: none;
      font: var(--mat-sys-label-large);
    }
    nav a mat-icon {
      font-size: 18px;
      width: 18px;
      height: 18px;
    }
    @media (max-width: 599.98px) {
      nav a {
        padding: 0 10px;
      }
      nav a mat-icon {
        display: none;
      }
    }
    nav a.active {
      background: var(--mat-sys-secondary-container);
      color: var(--mat-sys-on-secondary-container);
    }
    nav a:focus-visible {
      outline: 2px solid var(--mat-sys-primary);
      outline-offset: 2px;
    }
    .back {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      color: var(--mat-sys-primary);
    }
  `,
})
export class SystemNav {
  private readonly auth = inject(Auth);
  /** The system the pages belong to. */
  readonly systemId = input.required<string>();
  /** The system's name, for the navigation's label. */
  readonly name = input<string | null | undefined>(null);
  /** The page being shown. */
  readonly active = input.required<SystemSection>();

  protected readonly links = [
    { section: 'live', label: 'Now', icon: 'bolt', path: (id: string) => ['/systems', id] },
    {
      section: 'history',
      label: 'History',
      icon: 'timeline',
      path: (id: string) => ['/systems', id, 'history'],
    },
    {
      section: 'alerts',
      label: 'Alerts',
      icon: 'notifications',
      path: (id: string) => ['/systems', id, 'alerts'],
    },
    {
      section: 'battery-health',
      label: 'Health',
      icon: 'monitor_heart',
      path: (id: string) => ['/systems', id, 'battery-health'],
    },
    {
      section: 'settings',
      label: 'Settings',
      icon: 'tune',
      path: (id: string) => ['/systems', id, 'settings'],
    },
    {
      section: 'readings-transfer',
      label: 'CSV',
      icon: 'import_export',
      path: (id: string) => ['/systems', id, 'readings-transfer'],
    },
    {
      section: 'devices',
      label: 'Devices',
      icon: 'sensors',
      path: (id: string) => ['/systems', id, 'devices'],
      // By the access rule the owner and the installers of the system's company manage its devices.
      roles: ['owner', 'installer'] as Role[],
    },
    {
      section: 'access',
      label: 'Access',
      icon: 'key',
      path: (id: string) => ['/systems', id, 'access'],
      roles: ['owner'] as Role[],
    },
    {
      section: 'commissioning',
      label: 'Commissioning',
      icon: 'fact_check',
      path: (id: string) => ['/systems', id, 'commissioning'],
      roles: ['installer', 'admin', 'owner'] as Role[],
    },
    // Everyone who may view the system reads its register; changing it is the server's decision.
    {
      section: 'install',
      label: 'Register',
      icon: 'cable',
      path: (id: string) => ['/systems', id, 'install'],
    },
  ] as const;

  /** Pages whose route the person's roles open; the server still decides per system. */
  protected readonly visibleLinks = computed(() =>
    this.links.filter((link) => !('roles' in link) || this.auth.hasAnyRole(link.roles)),
  );
}
