import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
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
    // By hand (IEC 60028, 1/58 Ω·mm²/m): 20 A × 6 m / (58 × 8.367 mm²) = 0.247 V = 2.06 % of 12 V.
    expect(shown).toContain('0.25 V (2.06 %)');
    // Fuse between 125 % of 20 A = 25 A and the 8 AWG 105 °C ampacity of 80 A (ABYC E-11).
    expect(shown).toContain('25 A to 80 A');
    expect(shown).toContain('This wire and fuse pair passes');
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
    // By hand: 14 AWG is 2.08 mm² (ASTM B258) → 20 × 6 / (58 × 2.08) = 0.99 V, above the 3 % allowance of 0.36 V.
    expect(shown).toMatch(/14 AWG loses 0\.99 V/);
  });
});
