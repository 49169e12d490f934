import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Role } from '@cellwarden/shared';
import { Auth } from '../auth';
import { SystemNav } from './system-nav';

describe('SystemNav', () => {
  let roles: Role[] = [];
  beforeEach(() => {
    roles = [];
    TestBed.configureTestingModule({
      imports: [SystemNav],
      providers: [
        provideRouter([]),
        {
          provide: Auth,
          useValue: { hasAnyRole: (wanted: readonly Role[]) => wanted.some((r) => roles.includes(r)) },
        },
      ],
    });
  });

  async function render(active: string) {
    const fixture = TestBed.createComponent(SystemNav);
    fixture.componentRef.setInput('systemId', 'van 1');
    fixture.componentRef.setInput('name', 'Blue van');
    fixture.componentRef.setInput('active', active);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  it('links to the pages every viewer has, the readings CSV and install register included, escaping its id', async () => {
    const links = Array.from((await render('live')).querySelectorAll('nav a'), (a) => a.getAttribute('href'));
    expect(links).toEqual([
      '/systems/van%201',
      '/systems/van%201/history',
      '/systems/van%201/alerts',
      '/systems/van%201/battery-health',
      '/systems/van%201/settings',
      '/systems/van%201/readings-transfer',
      '/systems/van%201/install',
    ]);
  });

  it('adds the access page for owners and the commissioning page for installers', async () => {
    roles = ['owner'];
    const ownerLinks = Array.from((await render('live')).querySelectorAll('nav a'), (a) =>
      a.textContent?.trim(),
    );
    expect(ownerLinks).toEqual(expect.arrayContaining(['boltNow', 'keyAccess', 'fact_checkCommissioning']));
    roles = ['installer'];
    const fitterLinks = Array.from((await render('live')).querySelectorAll('nav a'), (a) =>
      a.textContent?.trim(),
    );
    expect(fitterLinks).not.toContain('keyAccess');
    expect(fitterLinks).toContain('fact_checkCommissioning');
  });

  it('shows device management to owners and installers, whom the access rule lets manage devices', async () => {
    const labels = async () =>
      Array.from((await render('live')).querySelectorAll('nav a'), (a) => a.textContent?.trim());
    roles = ['installer'];
    expect(await labels()).toContain('sensorsDevices');
    roles = ['owner'];
    expect(await labels()).toContain('sensorsDevices');
    roles = ['support'];
    expect(await labels()).not.toContain('sensorsDevices');
    roles = ['admin'];
    expect(await labels()).not.toContain('sensorsDevices');
  });

  it('marks the page being shown for assistive technology', async () => {
    const current = (await render('alerts')).querySelector('[aria-current="page"]');
    expect(current?.textContent).toContain('Alerts');
  });

  it('names the navigation after the system', async () =>
    expect((await render('live')).querySelector('nav')?.getAttribute('aria-label')).toBe(
      'Pages of Blue van',
    ));
});
