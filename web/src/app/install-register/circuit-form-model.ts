// The circuit form: its controls with the same names as the API (so a field the server blames finds its
// control), the ambient in the person's temperature unit, and the conversions both ways.
import { FormControl, FormGroup, Validators, type ValidatorFn } from '@angular/forms';
import { AWG_SIZES, type CircuitWiring, type RegisterCircuit } from '@cellwarden/shared';
import { TemperatureUnit, inUnit, toCelsius } from '../core/temperature-unit';

// A control with a default keeps it on reset (nonNullable), so a fresh form after a save starts from it again.
const number = (value: number | null, validators: ValidatorFn[] = []) =>
  new FormControl<number | null>(value, { validators, nonNullable: value !== null });

/** A fresh circuit form with the defaults an installer most often keeps. */
export function circuitForm() {
  return new FormGroup({
    name: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.maxLength(120)],
    }),
    componentId: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    conductorKind: new FormControl<'awg' | 'mm2'>('awg', { nonNullable: true }),
    awg: new FormControl<string>('4', { nonNullable: true }),
    mm2: number(null, [Validators.min(0.5), Validators.max(500)]),
    construction: new FormControl<CircuitWiring['construction']>('stranded', { nonNullable: true }),
    oneWayLengthM: number(null, [Validators.required, Validators.min(0.01), Validators.max(100)]),
    insulationRatingC: new FormControl<CircuitWiring['insulationRatingC']>(105, { nonNullable: true }),
    location: new FormControl<CircuitWiring['location']>('general', { nonNullable: true }),
    ambient: number(30, [Validators.required, Validators.min(-40), Validators.max(212)]),
    bundledConductors: number(2, [Validators.required, Validators.min(1), Validators.max(100)]),
    protection: new FormGroup({
      device: new FormControl<'fuse' | 'breaker'>('fuse', { nonNullable: true }),
      ratingA: number(null, [Validators.required, Validators.min(0.5), Validators.max(1000)]),
      type: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(40)] }),
    }),
    fuseDistanceM: number(null, [Validators.min(0), Validators.max(100)]),
    sheathed: new FormControl(false, { nonNullable: true }),
    designCurrentA: number(null, [Validators.min(0.1), Validators.max(1000)]),
    allowedDropPercent: number(3, [Validators.required, Validators.min(0.5), Validators.max(20)]),
    monitoring: new FormControl<CircuitWiring['monitoring']>('none', { nonNullable: true }),
  });
}

/** The circuit form's type. */
export type CircuitForm = ReturnType<typeof circuitForm>;

/** The AWG sizes offered, thinnest first. */
export const AWG_CHOICES: readonly string[] = AWG_SIZES;

/** The form's value as the API's wiring (ambient back in °C). */
export function readCircuitForm(form: CircuitForm, unit: TemperatureUnit): CircuitWiring {
  const v = form.getRawValue();
  return {
    name: v.name.trim(),
    componentId: v.componentId,
    conductor: v.conductorKind === 'awg' ? { awg: v.awg } : { mm2: v.mm2 ?? 0 },
    construction: v.construction,
    oneWayLengthM: v.oneWayLengthM ?? 0,
    insulationRatingC: v.insulationRatingC,
    location: v.location,
    ambientC: Math.round(toCelsius(v.ambient ?? 30, unit) * 10) / 10,
    bundledConductors: v.bundledConductors ?? 1,
    protection: {
      device: v.protection.device,
      ratingA: v.protection.ratingA ?? 0,
      type: v.protection.type.trim(),
    },
    fuseDistanceM: v.fuseDistanceM,
    sheathed: v.sheathed,
    designCurrentA: v.designCurrentA,
    allowedDropPercent: v.allowedDropPercent ?? 3,
    monitoring: v.monitoring,
  };
}

/** Fills the form from a stored circuit, the ambient in the person's unit. */
export function fillCircuitForm(form: CircuitForm, circuit: RegisterCircuit, unit: TemperatureUnit): void {
  form.reset();
  form.patchValue({
    name: circuit.name,
    componentId: circuit.componentId,
    conductorKind: circuit.conductor.awg !== undefined ? 'awg' : 'mm2',
    awg: circuit.conductor.awg ?? '4',
    mm2: circuit.conductor.mm2 ?? null,
    construction: circuit.construction,
    oneWayLengthM: circuit.oneWayLengthM,
    insulationRatingC: circuit.insulationRatingC,
    location: circuit.location,
    ambient: Math.round(inUnit(circuit.ambientC, unit) * 10) / 10,
    bundledConductors: circuit.bundledConductors,
    protection: circuit.protection,
    fuseDistanceM: circuit.fuseDistanceM,
    sheathed: circuit.sheathed,
    designCurrentA: circuit.designCurrentA,
    allowedDropPercent: circuit.allowedDropPercent,
    monitoring: circuit.monitoring,
  });
}

/** The form control a field named by the server belongs to (`conductor.awg` → awg, `ambientC` → ambient). */
export function controlPathOf(field: string, conductorKind: 'awg' | 'mm2'): string {
  if (field === 'ambientC') return 'ambient';
  if (field.startsWith('conductor'))
    return field === 'conductor.mm2' ? 'mm2' : field === 'conductor.awg' ? 'awg' : conductorKind;
  return field;
}
