import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { AuditEntry } from '@cellwarden/shared';
import { Audit } from './audit';

const entries: AuditEntry[] = Array.from({ length: 30 }, (_, i) => ({
  id: `e${i}`,
  at: Date.UTC(2026, 11, 2, 12) - i * 60_000,
  actor: i % 2 ? { id: 'u2', displayName: 'Kim', email: 'kim@example.com' } : null,
  action: i === 0 ? 'grant.created' : 'readings.viewed',
  detail: `entry ${i}`,
}));

describe('Audit', () => {
  async function render(body: object, status = 200) {
    TestBed.configureTestingModule({
      imports: [Audit],
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    const fixture = TestBed.createComponent(Audit);
    fixture.componentRef.setInput('systemId', 's1');
    fixture.detectChanges();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/systems/s1/audit')
      .flush(body, { status, statusText: 'x' });
    await fixture.whenStable();
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('shows the first page of 25 entries in words', async () => {
    const { loader } = await render({ entries });
    const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['detail'].text).toHaveLength(25);
    expect(cells['action'].text[0]).toBe('Granted access');
    expect(cells['actor'].text.slice(0, 2)).toEqual(['Cellwarden', 'Kim']);
  });

  it('turns to the next page', async () => {
    const { loader } = await render({ entries });
    await (await loader.getHarness(MatPaginatorHarness)).goToNextPage();
    const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['detail'].text).toEqual(['entry 25', 'entry 26', 'entry 27', 'entry 28', 'entry 29']);
  });

  it('says so when the trail is empty', async () => {
    const { fixture } = await render({ entries: [] });
    expect(fixture.nativeElement.textContent).toContain('Nothing recorded yet.');
  });

  it('shows an error when the trail cannot be loaded', async () => {
    const { fixture } = await render({ error: { code: 'forbidden', message: 'no' } }, 403);
    expect(fixture.nativeElement.querySelector('[role="alert"]')).not.toBeNull();
  });
});
