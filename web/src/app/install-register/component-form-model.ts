// The component form: one group holding every kind's fields; only the chosen kind's are enabled, so only
// they are validated and sent. Shares and efficiencies are entered in per cent, sent as fractions.
import { FormControl, FormGroup, Validators } from '@angular/forms';
import type { ComponentKind, ComponentRatings, RegisterComponent } from '@cellwarden/shared';

const num = (value: number | null, min: number, max: number, required = true) =>
  new FormControl<number | null>(value, {
    validators: [...(required ? [Validators.required] : []), Validators.min(min), Validators.max(max)],
    // A control with a default keeps it on reset.
    nonNullable: value !== null,
  });

/** Fields of each kind, by control name. */
export const KIND_FIELDS: Record<ComponentKind, readonly string[]> = {
  battery: ['chemistry', 'capacityAh', 'bmsContinuousA', 'bmsPeakA', 'bmsPeakSeconds'],
  'charge-source': ['sourceKind', 'ratedCurrentA', 'monitorSourceId', 'panelWatts', 'hoursPerDay'],
  inverter: ['continuousW', 'surgeW', 'standbyW', 'efficiencyPercent'],
  heater: ['draw', 'amps', 'watts', 'hoursPerDay', 'dutyPercent', 'ac'],
  fridge: ['draw', 'amps', 'watts', 'hoursPerDay', 'dutyPercent', 'ac'],
  load: ['draw', 'amps', 'watts', 'hoursPerDay', 'dutyPercent', 'ac'],
};

/** A fresh component form (a battery until the kind is changed). */
export function componentForm() {
  const form = new FormGroup({
    name: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.maxLength(120)],
    }),
    kind: new FormControl<ComponentKind>('battery', { nonNullable: true }),
    chemistry: new FormControl<'lifepo4' | 'agm' | 'flooded'>('lifepo4', { nonNullable: true }),
    capacityAh: num(null, 1, 20000),
    bmsContinuousA: num(null, 1, 2000),
    bmsPeakA: num(null, 1, 10000, false),
    bmsPeakSeconds: num(null, 1, 600, false),
    sourceKind: new FormControl<'dc-dc' | 'solar' | 'shore' | 'alternator' | 'other'>('dc-dc', {
      nonNullable: true,
    }),
    ratedCurrentA: num(null, 0.1, 1000),
    monitorSourceId: new FormControl('', {
      nonNullable: true,
      validators: [Validators.pattern(/^([a-z0-9][a-z0-9-]{0,31})?$/)],
    }),
    panelWatts: num(null, 1, 20000, false),
    hoursPerDay: num(null, 0, 24),
    continuousW: num(null, 1, 20000),
    surgeW: num(null, 1, 60000),
    standbyW: num(0, 0, 1000),
    efficiencyPercent: num(90, 50, 100),
    draw: new FormControl<'amps' | 'watts'>('amps', { nonNullable: true }),
    amps: num(null, 0.01, 1000),
    watts: num(null, 1, 20000),
    dutyPercent: num(100, 0, 100),
    ac: new FormControl(false, { nonNullable: true }),
  });
  showKind(form, 'battery');
  return form;
}

/** The component form's type. */
export type ComponentForm = ReturnType<typeof componentForm>;

/** Enables the kind's fields and disables the others (and amps or watts by the draw chosen). */
export function showKind(form: ComponentForm, kind: ComponentKind): void {
  const own = new Set(KIND_FIELDS[kind]);
  for (const [name, control] of Object.entries(form.controls)) {
    if (name === 'name' || name === 'kind') continue;
    if (own.has(name)) control.enable({ emitEvent: false });
    else control.disable({ emitEvent: false });
  }
  if (own.has('draw')) {
    const byAmps = form.controls.draw.value === 'amps';
    (byAmps ? form.controls.watts : form.controls.amps).disable({ emitEvent: false });
  }
}

const optional = (value: number | null) => (value === null ? undefined : value);

/** The form's value as the API's name and ratings. */
export function readComponentForm(form: ComponentForm): { name: string; ratings: ComponentRatings } {
  const v = form.getRawValue();
  const name = v.name.trim();
  switch (v.kind) {
    case 'battery':
      return {
        name,
        ratings: {
          kind: 'battery',
          chemistry: v.chemistry,
          capacityAh: v.capacityAh ?? 0,
          bmsContinuousA: v.bmsContinuousA ?? 0,
          bmsPeakA: optional(v.bmsPeakA),
          bmsPeakSeconds: optional(v.bmsPeakSeconds),
        },
      };
    case 'charge-source':
      return {
        name,
        ratings: {
          kind: 'charge-source',
          sourceKind: v.sourceKind,
          ratedCurrentA: v.ratedCurrentA ?? 0,
          monitorSourceId: v.monitorSourceId.trim() || undefined,
          panelWatts: optional(v.panelWatts),
          hoursPerDay: v.hoursPerDay ?? 0,
        },
      };
    case 'inverter':
      return {
        name,
        ratings: {
          kind: 'inverter',
          continuousW: v.continuousW ?? 0,
          surgeW: v.surgeW ?? 0,
          standbyW: v.standbyW ?? 0,
          efficiency: (v.efficiencyPercent ?? 90) / 100,
        },
      };
    default:
      return {
        name,
        ratings: {
          kind: v.kind,
          ...(v.draw === 'amps' && !v.ac ? { amps: v.amps ?? 0 } : { watts: v.watts ?? 0 }),
          hoursPerDay: v.hoursPerDay ?? 0,
          dutyCycle: (v.dutyPercent ?? 100) / 100,
          ac: v.ac,
        },
      };
  }
}

/** Fills the form from a stored component. */
export function fillComponentForm(form: ComponentForm, component: RegisterComponent): void {
  const r = component.ratings;
  form.reset();
  const values: Record<string, unknown> = { name: component.name, kind: r.kind };
  if (r.kind === 'inverter')
    Object.assign(values, r, { efficiencyPercent: Math.round(r.efficiency * 1000) / 10 });
  else if (r.kind === 'heater' || r.kind === 'fridge' || r.kind === 'load')
    Object.assign(values, r, {
      draw: r.amps !== undefined ? 'amps' : 'watts',
      dutyPercent: Math.round(r.dutyCycle * 1000) / 10,
    });
  else Object.assign(values, r);
  form.patchValue(values);
  showKind(form, r.kind);
}
