import { componentForm, fillComponentForm, readComponentForm, showKind } from './component-form-model';

describe('component form', () => {
  it('sends only the chosen kind’s ratings, shares as fractions', () => {
    const form = componentForm();
    form.patchValue({
      name: ' Inverter 2000 W ',
      kind: 'inverter',
      continuousW: 2000,
      surgeW: 4000,
      standbyW: 10,
      efficiencyPercent: 92,
    });
    showKind(form, 'inverter');
    expect(form.valid).toBe(true);
    expect(readComponentForm(form)).toEqual({
      name: 'Inverter 2000 W',
      ratings: { kind: 'inverter', continuousW: 2000, surgeW: 4000, standbyW: 10, efficiency: 0.92 },
    });
  });

  it('validates only the fields of the kind shown', () => {
    const form = componentForm();
    form.patchValue({ name: 'Heater', kind: 'heater', amps: null, hoursPerDay: 8 });
    showKind(form, 'heater');
    expect(form.controls.amps.hasError('required')).toBe(true);
    expect(form.controls.capacityAh.disabled).toBe(true);
    form.patchValue({ amps: 1.5 });
    expect(form.valid).toBe(true);
  });

  it('gives an AC load in watts and refills a stored load the same', () => {
    const form = componentForm();
    fillComponentForm(form, {
      id: 'x',
      name: 'Kettle',
      ratings: { kind: 'load', watts: 1200, hoursPerDay: 0.2, dutyCycle: 1, ac: true },
    });
    expect(form.controls.draw.value).toBe('watts');
    expect(form.controls.amps.disabled).toBe(true);
    expect(readComponentForm(form)).toEqual({
      name: 'Kettle',
      ratings: { kind: 'load', watts: 1200, hoursPerDay: 0.2, dutyCycle: 1, ac: true },
    });
  });
});
