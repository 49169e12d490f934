import type { RegisterCircuit } from '@cellwarden/shared';
import { circuitForm, controlPathOf, fillCircuitForm, readCircuitForm } from './circuit-form-model';

const stored: RegisterCircuit = {
  id: 'c1',
  name: 'Heater feed',
  componentId: 'h1',
  conductor: { mm2: 4 },
  construction: 'fine-stranded',
  oneWayLengthM: 3,
  insulationRatingC: 90,
  location: 'engine-space',
  ambientC: 50,
  bundledConductors: 3,
  protection: { device: 'fuse', ratingA: 15, type: 'blade' },
  fuseDistanceM: 1.5,
  sheathed: false,
  designCurrentA: 10,
  allowedDropPercent: 3,
  monitoring: 'none',
  verdict: {
    ok: false,
    summary: '',
    rule: '',
    checkedAwg: '12',
    currentA: 10,
    ampacityA: null,
    maximumFuseA: null,
    findings: [],
  },
};

describe('circuit form', () => {
  it('shows the ambient in °F and sends it back in °C', () => {
    const form = circuitForm();
    fillCircuitForm(form, stored, 'F');
    // °F = °C × 9/5 + 32: 50 °C is 122 °F
    expect(form.controls.ambient.value).toBe(122);
    const { verdict: _verdict, id: _id, ...wiring } = stored;
    expect(readCircuitForm(form, 'F')).toEqual(wiring);
  });

  it('requires the run length and the protection rating, and bounds the fuse distance', () => {
    const form = circuitForm();
    form.patchValue({ name: 'x', componentId: 'h1', fuseDistanceM: -1 });
    expect(form.controls.oneWayLengthM.hasError('required')).toBe(true);
    expect(form.controls.protection.controls.ratingA.hasError('required')).toBe(true);
    expect(form.controls.fuseDistanceM.hasError('min')).toBe(true);
  });

  it('finds the control for a field the server names', () => {
    expect(controlPathOf('ambientC', 'awg')).toBe('ambient');
    expect(controlPathOf('conductor.awg', 'awg')).toBe('awg');
    expect(controlPathOf('conductor', 'mm2')).toBe('mm2');
    expect(controlPathOf('protection.ratingA', 'awg')).toBe('protection.ratingA');
  });
});

describe('circuit form after a save', () => {
  it('starts again from the defaults: 30 °C ambient, two conductors bundled, 3 % drop', () => {
    const form = circuitForm();
    form.patchValue({ ambient: 45, bundledConductors: 6, allowedDropPercent: 10 });
    form.reset();
    expect(form.getRawValue()).toMatchObject({ ambient: 30, bundledConductors: 2, allowedDropPercent: 3 });
  });
});
