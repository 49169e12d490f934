import { TestBed } from '@angular/core/testing';
import type { MonitorLatest } from '@cellwarden/shared';
import { BankMonitors } from './bank-monitors';

const monitor = (deviceId: string, label: string, lead: boolean, voltage: number | null): MonitorLatest => ({
  deviceId,
  label,
  lead,
  reading:
    voltage === null
      ? null
      : {
          measuredAt: Date.UTC(2026, 11, 3, 6),
          receivedAt: 0,
          voltage,
          current: -2.5,
          temperature: 3,
          deviceId,
        },
});

function render(monitors: MonitorLatest[]): HTMLElement {
  const fixture = TestBed.createComponent(BankMonitors);
  fixture.componentRef.setInput('monitors', monitors);
  fixture.detectChanges();
  return fixture.nativeElement as HTMLElement;
}

describe('BankMonitors', () => {
  it('labels each monitor with its own values and names the one the headline follows', () => {
    const el = render([monitor('shunt', 'Main shunt', true, 13.21), monitor('bms', 'BMS port', false, 13.6)]);
    expect(el.querySelector('.note')?.textContent).toContain('The figures above come from Main shunt');
    const items = [...el.querySelectorAll('li')];
    expect(items.map((li) => li.getAttribute('aria-label'))).toEqual(['Main shunt', 'BMS port']);
    expect(items[0].textContent).toContain('lead monitor');
    expect(items[0].textContent).toContain('13.21 V');
    expect(items[1].textContent).toContain('13.60 V');
    expect(items[1].textContent).toContain('also on this bank');
  });

  it('says when a monitor has not reported yet', () => {
    const el = render([monitor('shunt', 'Main shunt', true, 13.2), monitor('new', 'Spare', false, null)]);
    expect(el.querySelectorAll('li')[1].textContent).toContain('Has not reported yet.');
  });
});
