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
      providers: [provideCharts(withDefaultRegisterables())],
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
    expect(shown['Energy out']).toBe('432 Wh/day');
    expect(shown['Balance']).toBe('+208 Wh/day (17.3 Ah)');
    // Suggested battery: 432 Wh × 2 days / (12 V × 0.9) = 80 Ah.
    expect(shown['Suggested battery']).toBe('80 Ah');
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
    expect(shown['Balance']).toMatch(/^-792 Wh\/day/);
    // P / (V × η) = 2000 W / (12 V × 0.9) = 185.2 A, above the 100 A BMS rating.
    expect(shown['Inverter draw at rating vs BMS']).toBe('185.2 A of 100 A');
    expect(await summary()).toContain('The system is not matched');
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
      'Energy in 640 Wh a day, energy out 432 Wh a day: 208 Wh to spare.',
    );
    expect(fixture.nativeElement.querySelector('table.cw-visually-hidden').textContent).toContain('640 Wh');
  });
});
