import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { WireFuse } from './wire-fuse';

describe('WireFuse', () => {
  async function setup() {
    TestBed.configureTestingModule({ imports: [WireFuse] });
    const fixture = TestBed.createComponent(WireFuse);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const type = async (name: string, value: string) =>
      (await loader.getHarness(MatInputHarness.with({ selector: `[formControlName="${name}"]` }))).setValue(
        value,
      );
    const text = async () => {
      await fixture.whenStable();
      return (fixture.nativeElement as HTMLElement).querySelector('.result')?.textContent ?? '';
    };
    return { fixture, loader, type, text };
  }

  it('shows the cautions before any number is entered', async () => {
    const { fixture } = await setup();
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('.cautions').textContent).toContain(
      'Put the fuse as close to the battery',
    );
  });

  it('names the field in its validation message', async () => {
    const { loader, type } = await setup();
    await type('currentA', '0');
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="currentA"]' }))
    ).blur();
    const field = await loader.getHarness(
      MatFormFieldHarness.with({ floatingLabelText: 'Continuous current' }),
    );
    expect(await field.getTextErrors()).toEqual(['Continuous current must be above 0 and at most 1000 A.']);
  });

  it('sizes 20 A over 3 m at 12 V and 3 % to 8 AWG with its metric size, drop and fuse range', async () => {
    const { type, text } = await setup();
    await type('currentA', '20');
    await type('oneWayLengthM', '3');
    const shown = await text();
    // ASTM B258: 8 AWG = 8.37 mm²; the next IEC 60228 size up is 10 mm².
    expect(shown).toContain('8 AWG · 8.37 mm² (metric: 10 mm²)');
    // ABYC E-11 ampacity at 105 °C: 125 % × 20 A = 25 A → 16 AWG (1.31 mm², ASTM B258).
    expect(shown).toContain('16 AWG · 1.31 mm²');
    // NEC Chapter 9 Table 8 stranded 8 AWG 0.778 Ω/kft at 75 °C × 0.8224 (note 2, 20 °C) = 2.099 mΩ/m;
    // 20 A × 6 m × 2.099 mΩ/m = 0.252 V = 2.10 % of 12 V.
    expect(shown).toContain('0.25 V (2.1 %)');
    // Fuse from 125 % of 20 A = 25 A (NEC 210.20(A)) to 150 % of 8 AWG's 80 A = 120 A (33 CFR 183.455(c)(1)).
    expect(shown).toContain('25 A to 120 A');
    expect(shown).toMatch(/Recommended conductor and fuse\s*8 AWG[\s\S]*Fuse 25 A/);
    expect(shown).toContain('This wire and fuse pair passes');
    // The conductor temperature and construction used for the drop are said on screen.
    expect(shown).toContain('stranded copper (NEC Chapter 9 Table 8 stranded rows) at 20 °C');
  });

  it('fails a proposed 14 AWG on that run with the reason', async () => {
    const { loader, type, text } = await setup();
    await type('currentA', '20');
    await type('oneWayLengthM', '3');
    const gauge = await loader.getHarness(
      MatSelectHarness.with({ selector: '[formControlName="proposedGauge"]' }),
    );
    await gauge.open();
    await gauge.clickOptions({ text: '14 AWG' });
    const shown = await text();
    expect(shown).toContain('This pair does not pass');
    // NEC Chapter 9 Table 8 stranded 14 AWG 3.14 Ω/kft × 0.8224 = 8.47 mΩ/m → 20 A × 6 m = 1.02 V > 0.36 V (3 %).
    expect(shown).toMatch(/14 AWG loses 1\.02 V/);
  });

  it('judges the fuse distance and the sheath the installer enters', async () => {
    const { loader, type, text } = await setup();
    await type('currentA', '60');
    await type('oneWayLengthM', '2');
    await type('fuseDistanceM', '0.5');
    // 33 CFR 183.455(b): 0.5 m is beyond 7 in (178 mm) unless sheathed, then within 40 in (1.02 m).
    expect(await text()).toContain('This pair does not pass');
    expect(await text()).toMatch(/500 mm from the battery leaves that conductor unprotected/);
    await (await loader.getHarness(MatCheckboxHarness.with({ label: /Sheathed or enclosed/ }))).check();
    expect(await text()).toContain('This wire and fuse pair passes');
    expect(await text()).toMatch(/within 1\.02 m \(40 in\)/);
  });

  it('derates for an engine space and a bundle and cites the rules', async () => {
    const { loader, type, text } = await setup();
    await type('currentA', '100');
    await type('oneWayLengthM', '0.5');
    await (await loader.getHarness(MatCheckboxHarness.with({ label: /engine space/ }))).check();
    await type('bundledConductors', '5');
    const shown = await text();
    // 33 CFR 183.425 Table 5 105 °C × 0.86 (note 1, engine spaces) × 0.60 (note 2, 4–6 bundled) = × 0.516:
    // 125 A needed → 2 AWG 210 × 0.516 = 108 A is short, 1 AWG 245 × 0.516 = 126.4 A carries it
    expect(shown).toContain('Minimum by ampacity (125 % of the load, derated)');
    expect(shown).toContain('1 AWG · 42.41 mm²');
    expect(shown).toMatch(/33 CFR 183\.425\(c\)/);
    expect(shown).toMatch(/Table 5 note 2/);
  });

  it('starts from a circuit handed over by the energy budget', async () => {
    const { fixture, text } = await setup();
    fixture.componentRef.setInput('prefill', {
      circuit: 'Inverter feeder',
      currentA: 185.185,
      systemVoltage: 12,
    });
    await fixture.whenStable();
    const input = (fixture.nativeElement as HTMLElement).querySelector<HTMLInputElement>(
      '[formControlName="currentA"]',
    );
    // Rounded up to a tenth, never down: 185.185 A → 185.2 A
    expect(input?.value).toBe('185.2');
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Checking the Inverter feeder');
    expect(await text()).toContain('Enter the current and the run length');
  });
});
