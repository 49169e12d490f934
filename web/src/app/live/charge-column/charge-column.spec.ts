import { TestBed } from '@angular/core/testing';
import { ChargeColumn } from './charge-column';

describe('ChargeColumn', () => {
  async function render(inputs: Record<string, unknown>) {
    const fixture = TestBed.createComponent(ChargeColumn);
    for (const [name, value] of Object.entries(inputs)) fixture.componentRef.setInput(name, value);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  it('describes the charge, its band and the morning projection in words', async () => {
    const host = await render({ stateOfCharge: 24.4, source: 'estimated', projected: 11 });
    expect(host.querySelector('svg')?.getAttribute('aria-label')).toBe(
      'State of charge 24 %, low; estimated by Cellwarden; about 11 % by morning',
    );
    expect(host.classList).toContain('band-low');
  });

  it('says a stale value is not current', async () => {
    const host = await render({ stateOfCharge: 80, stale: true });
    expect(host.querySelector('svg')?.getAttribute('aria-label')).toContain('last known value, not current');
  });

  it('admits when the charge is unknown', async () => {
    const host = await render({ stateOfCharge: null });
    expect(host.querySelector('svg')?.getAttribute('aria-label')).toBe('State of charge unknown');
    expect(host.textContent).toContain('—');
  });
});
