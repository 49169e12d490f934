import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { SystemNav } from './system-nav';

describe('SystemNav', () => {
  beforeEach(() => TestBed.configureTestingModule({ imports: [SystemNav], providers: [provideRouter([])] }));

  async function render(active: string) {
    const fixture = TestBed.createComponent(SystemNav);
    fixture.componentRef.setInput('systemId', 'van 1');
    fixture.componentRef.setInput('name', 'Blue van');
    fixture.componentRef.setInput('active', active);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  it('links to the four pages of the system, escaping its id', async () => {
    const links = Array.from((await render('live')).querySelectorAll('nav a'), (a) => a.getAttribute('href'));
    expect(links).toEqual([
      '/systems/van%201',
      '/systems/van%201/history',
      '/systems/van%201/alerts',
      '/systems/van%201/settings',
    ]);
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
