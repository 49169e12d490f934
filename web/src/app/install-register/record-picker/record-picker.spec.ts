import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import type { RecordCheckChoice } from '@cellwarden/shared';
import { RecordPicker } from './record-picker';

const choice = (checkId: string, over: Partial<RecordCheckChoice>): RecordCheckChoice => ({
  checkId,
  sourceId: 'dcdc',
  status: 'passed',
  startedAt: Date.UTC(2026, 11, 2, 9),
  ratedCurrentA: 60,
  byDefault: true,
  leftOutBecause: null,
  ...over,
});

describe('RecordPicker', () => {
  let http: HttpTestingController;
  beforeEach(() => {
    URL.createObjectURL = () => 'blob:pdf';
    URL.revokeObjectURL = () => undefined;
    jest.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined);
    TestBed.configureTestingModule({
      imports: [RecordPicker],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => jest.restoreAllMocks());

  async function render() {
    const fixture = TestBed.createComponent(RecordPicker);
    fixture.componentRef.setInput('systemId', 'van-1');
    fixture.detectChanges();
    http.expectOne('/api/systems/van-1/commissioning-record/choices').flush({
      choices: [
        choice('latest', {}),
        choice('older', { byDefault: false, leftOutBecause: 'superseded', status: 'failed' }),
        choice('running', { byDefault: false, leftOutBecause: 'unfinished', status: 'running' }),
      ],
    });
    await fixture.whenStable();
    fixture.detectChanges();
    return { fixture, page: fixture.nativeElement as HTMLElement };
  }

  it('says why a check is left out by default and asks for exactly the picked checks', async () => {
    const { fixture, page } = await render();
    expect(page.textContent).toContain('Left out by default: a later check of this source replaces it');
    const boxes = page.querySelectorAll<HTMLInputElement>('input[type="checkbox"]');
    expect([...boxes].map((b) => [b.checked, b.disabled])).toEqual([
      [true, false],
      [false, false],
      [false, true],
    ]);
    boxes[1].click();
    fixture.detectChanges();
    page.querySelector<HTMLButtonElement>('button')!.click();
    const request = http.expectOne((r) => r.url === '/api/systems/van-1/commissioning-record.pdf');
    expect(request.request.params.get('checks')).toBe('latest,older');
    request.flush(new Blob(['%PDF-']));
  });
});
