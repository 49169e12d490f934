import { HttpEventType, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatListHarness } from '@angular/material/list/testing';
import { MatProgressBarHarness } from '@angular/material/progress-bar/testing';
import { Uploads } from './uploads';

describe('Uploads', () => {
  async function render() {
    TestBed.configureTestingModule({
      imports: [Uploads],
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    const fixture = TestBed.createComponent(Uploads);
    fixture.componentRef.setInput('systemId', 's1');
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/systems/s1/uploads').flush({
      uploads: [
        {
          id: 'f1',
          kind: 'photo',
          fileName: 'fuses.jpg',
          contentType: 'image/jpeg',
          bytes: 2_411_724,
          uploadedAt: Date.UTC(2026, 11, 1, 10),
          caption: 'Main fuse holder',
        },
      ],
    });
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const pick = async (file: File) => {
      const input: HTMLInputElement = fixture.nativeElement.querySelector('input[type="file"]');
      Object.defineProperty(input, 'files', { value: [file], configurable: true });
      input.dispatchEvent(new Event('change'));
      await fixture.whenStable();
    };
    const alerts = () =>
      [...fixture.nativeElement.querySelectorAll('[role="alert"]')].map((e: Element) =>
        e.textContent?.trim(),
      );
    return { fixture, http, loader, pick, alerts };
  }

  const fileOf = (name: string, type: string, bytes: number) => {
    const file = new File(['x'], name, { type });
    Object.defineProperty(file, 'size', { value: bytes });
    return file;
  };

  it('lists uploads with their size and date', async () => {
    const { loader } = await render();
    const items = await (await loader.getHarness(MatListHarness)).getItems();
    expect(await items[0].getTitle()).toBe('Main fuse holder');
    // 2,411,724 B / 1,048,576 = 2.3 MB (binary multiple, as file managers show it — common practice).
    expect(await items[0].getSecondaryText()).toMatch(/^fuses\.jpg · 2\.3 MB · /);
  });

  it('refuses a file over 10 MB before sending anything', async () => {
    const { http, loader, pick, alerts } = await render();
    await pick(fileOf('panorama.png', 'image/png', 12 * 1_048_576));
    expect(alerts()[0]).toContain('panorama.png is 12.0 MB; the limit is 10 MB');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Upload' }))).click();
    http.expectNone({ method: 'POST' });
  });

  it('refuses a file of the wrong type', async () => {
    const { pick, alerts } = await render();
    await pick(fileOf('wiring.pdf', 'application/pdf', 1000));
    expect(alerts()[0]).toContain('wiring.pdf is application/pdf');
  });

  it('asks for a file when none is chosen', async () => {
    const { fixture, loader, alerts } = await render();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Upload' }))).click();
    await fixture.whenStable();
    expect(alerts()[0]).toBe('File: choose a photo or a log to upload.');
  });

  it('sends the multipart form with progress and refreshes the list', async () => {
    const { fixture, http, loader, pick } = await render();
    await pick(fileOf('charger.csv', 'text/csv', 4000));
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="caption"]' }))
    ).setValue('Charger log, day 1');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Upload' }))).click();
    const request = http.expectOne({ method: 'POST', url: '/api/systems/s1/uploads' });
    const body = request.request.body as FormData;
    expect((body.get('file') as File).name).toBe('charger.csv');
    expect(body.get('caption')).toBe('Charger log, day 1');
    expect(body.get('kind')).toBe('log');
    request.event({ type: HttpEventType.UploadProgress, loaded: 1000, total: 4000 });
    await fixture.whenStable();
    expect(await (await loader.getHarness(MatProgressBarHarness)).getValue()).toBe(25);
    request.flush({ id: 'f2' }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    http.expectOne('/api/systems/s1/uploads').flush({ uploads: [] });
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('[role="status"]').textContent).toContain(
      'charger.csv uploaded.',
    );
  });
});
