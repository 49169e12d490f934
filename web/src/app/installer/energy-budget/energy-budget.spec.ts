import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideCharts, withDefaultRegisterables } from 'ng2-charts';
import { EnergyBudgetEditor } from './energy-budget';

describe('EnergyBudgetEditor', () => {
  // jsdom has no canvas; chart.js then reports that it cannot draw. Only that report is silenced.
  beforeEach(() => {
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
    const error = console.error.bind(console);
    jest.spyOn(console, 'error').mockImplementation((...args: unknown[]) => {
      if (!/acquire context/.test(String(args[0]))) error(...args);
    });
  });
  afterEach(() => jest.restoreAllMocks());

  async function setup() {
    TestBed.configureTestingModule({
      imports: [EnergyBudgetEditor],
      // The comparison section below the editor asks for the person's systems.
      providers: [provideCharts(withDefaultRegisterables()), provideHttpClient(), provideHttpClientTesting()],
    });
    const fixture = TestBed.createComponent(EnergyBudgetEditor);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const summary = async () => {
      await fixture.whenStable();
      return (
        (fixture.nativeElement as HTMLElement).querySelector('.summary')?.textContent?.replace(/\s+/g, ' ') ??
        ''
      );
    };
    /** The result figures as "label → value", read from the dt/dd pairs. */
    const figures = async () => {
      await fixture.whenStable();
      const pairs = (fixture.nativeElement as HTMLElement).querySelectorAll('.figures > div');
      const clean = (el: Element | null) => el?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
      return Object.fromEntries(
        Array.from(pairs).map((pair) => [clean(pair.querySelector('dt')), clean(pair.querySelector('dd'))]),
      );
    };
    const inputs = (name: string) =>
      loader.getAllHarnesses(MatInputHarness.with({ selector: `[formControlName="${name}"]` }));
    return { fixture, loader, summary, figures, inputs };
  }

  it('computes the example rows live', async () => {
    const { figures } = await setup();
    const shown = await figures();
    // By hand: fridge 45 W × 24 h × 40 % = 432 Wh; solar 200 W × 4 h × 0.8 (20 % derate, common practice) = 640 Wh.
    expect(shown['Energy in']).toBe('640 Wh/day');
    // LiFePO4 charge efficiency 99 % (profile, from memory): 633.6 Wh stored
    expect(shown['Stored after charge losses']).toBe('634 Wh/day (99 %)');
    expect(shown['Energy out']).toBe('432 Wh/day');
    // 633.6 − 432 = 201.6 Wh at 12.8 V (LiFePO4 nominal, 4 × 3.2 V) = 15.7 Ah
    expect(shown['Balance']).toMatch(/^\+202 Wh\/day \(15\.[78] Ah\)$/);
    // Suggested battery: 432 Wh × 2 days / (12.8 V × 0.9) = 75 Ah.
    expect(shown['Suggested battery']).toBe('75 Ah');
    expect(shown['Inverter standby']).toBe('0 Wh/day');
  });

  it('adds a load row and updates the balance', async () => {
    const { loader, inputs, summary, figures } = await setup();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add load/ }))).click();
    await (await inputs('name'))[1].setValue('Induction hob');
    await (await inputs('watts'))[1].setValue('1800');
    await (await inputs('hoursPerDay'))[1].setValue('0.5');
    await (await loader.getAllHarnesses(MatCheckboxHarness))[1].check();
    await (await inputs('inverterRatedW'))[0].setValue('2000');
    const shown = await figures();
    // By hand: 1800 W × 0.5 h / 0.90 inverter efficiency = 1000 Wh; + 432 Wh fridge = 1432 Wh out.
    expect(shown['Energy out']).toBe('1,432 Wh/day');
    // 633.6 Wh stored − 1432 Wh = −798.4 Wh
    expect(shown['Balance']).toMatch(/^-798 Wh\/day/);
    // P / (V × η) = 2000 W / (12 V × 0.9) = 185.2 A, above the 100 A BMS rating.
    expect(shown['Inverter draw at rating vs BMS']).toBe('185.2 A of 100 A');
    expect(await summary()).toContain('The system is not matched');
  });

  it('shows the inverter standby and its surge against the BMS peak rating', async () => {
    const { inputs, figures, summary } = await setup();
    await (await inputs('inverterRatedW'))[0].setValue('2000');
    await (await inputs('inverterStandbyW'))[0].setValue('10');
    await (await inputs('inverterSurgeW'))[0].setValue('4000');
    await (await inputs('bmsContinuousA'))[0].setValue('200');
    await (await inputs('bmsPeakA'))[0].setValue('300');
    const shown = await figures();
    // 10 W × 24 h = 240 Wh a day; surge 4000 W / (12 V × 0.9) = 370.4 A > 300 A peak
    expect(shown['Inverter standby']).toBe('240 Wh/day');
    expect(shown['Energy out']).toBe('672 Wh/day');
    expect(shown['Inverter surge vs BMS peak']).toBe('370.4 A of 300 A');
    expect(await summary()).toContain('above the BMS peak rating of 300 A');
  });

  it('opens a wire and fuse check prefilled with the inverter feeder current', async () => {
    const { fixture, loader, inputs } = await setup();
    await (await inputs('inverterRatedW'))[0].setValue('2000');
    await (await inputs('bmsContinuousA'))[0].setValue('200');
    await (
      await loader.getHarness(MatButtonHarness.with({ text: /Check wire & fuse\s*for Inverter feeder/ }))
    ).click();
    await fixture.whenStable();
    const check = (fixture.nativeElement as HTMLElement).querySelector(
      '[aria-label="Wire and fuse check for Inverter feeder"]',
    );
    // P / (V × η) = 2000 / (12 × 0.9) = 185.19 A, rounded up to a tenth
    expect(check?.querySelector<HTMLInputElement>('[formControlName="currentA"]')?.value).toBe('185.2');
    expect(check?.textContent).toContain('Checking the Inverter feeder');
    const lengths = await loader.getAllHarnesses(
      MatInputHarness.with({ selector: '[formControlName="oneWayLengthM"]' }),
    );
    await lengths[0].setValue('1.5');
    await fixture.whenStable();
    const result = check?.querySelector('.result')?.textContent?.replace(/\s+/g, ' ') ?? '';
    // 125 % × 185.2 A = 231.5 A → 1 AWG (245 A, 33 CFR 183.425 Table 5, 105 °C); fuse 250 A, allowed up to
    // 150 % × 245 A = 367.5 A (33 CFR 183.455(c)(1))
    expect(result).toMatch(
      /Recommended conductor and fuse 1 AWG[\s\S]*Fuse 250 A \(range 231\.5 to 367\.5 A\)/,
    );
    expect(result).toContain('This wire and fuse pair passes');
  });

  it('removes a source row', async () => {
    const { loader, figures } = await setup();
    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Remove source 1"]' }))
    ).click();
    expect((await figures())['Energy in']).toBe('0 Wh/day');
  });

  it('names the field whose value is out of range', async () => {
    const { loader, inputs, summary } = await setup();
    const duty = (await inputs('dutyPercent'))[0];
    await duty.setValue('140');
    await duty.blur();
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Duty cycle' }));
    expect(await field.getTextErrors()).toEqual(['Duty cycle must be 0 to 100 %.']);
    expect(await summary()).toContain('Fix the marked fields');
  });

  it('labels the chart with a summary and keeps a text table beside it', async () => {
    const { fixture } = await setup();
    await fixture.whenStable();
    const canvas: HTMLCanvasElement = fixture.nativeElement.querySelector('canvas');
    expect(canvas.getAttribute('aria-label')).toBe(
      'Chart of the daily energy budget. Energy stored 634 Wh a day, energy out 432 Wh a day: 202 Wh to spare.',
    );
    expect(fixture.nativeElement.querySelector('table.cw-visually-hidden').textContent).toContain('640 Wh');
  });
});
