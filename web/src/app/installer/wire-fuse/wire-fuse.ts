import { DecimalPipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  untracked,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import {
  AWG_SIZES,
  AwgSize,
  Chemistry,
  ConductorConstruction,
  FUSE_PLACEMENT_RULE,
  INSULATION_RATINGS_C,
  InsulationRatingC,
  ProtectionRules,
  SYSTEM_VOLTAGES,
  SystemVoltage,
  WIRE_AND_FUSE_CAUTIONS,
  WIRE_FUSE_DEFAULTS,
  conductorSize,
} from '@cellwarden/shared';
import { map, startWith } from 'rxjs';
import { Findings } from '../findings/findings';
import { WireFuseFormValue, runWireFuseCheck } from './wire-fuse-adapter';

/** A circuit to check, handed over by another tool (the energy budget's inverter feeder, a charger, a load). */
export interface WireFusePrefill {
  /** What the circuit feeds, shown above the form. */
  circuit: string;
  /** Continuous DC current, A. */
  currentA: number;
  systemVoltage: SystemVoltage;
  /** The bank behind it, for its short-circuit current. */
  bank?: { chemistry: Chemistry; capacityAh: number };
}

const optionalNumber = (min: number, max: number) => [
  null as number | null,
  [Validators.min(min), Validators.max(max)],
];
const requiredNumber = (value: number, min: number, max: number) => [
  value as number | null,
  [Validators.required, Validators.min(min), Validators.max(max)],
];

/** The wire & fuse check: conductor size by drop, ampacity and rule, the fuse range and placement, and a verdict, live. */
@Component({
  selector: 'cw-wire-fuse',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonToggleModule,
    MatCheckboxModule,
    MatIconModule,
    DecimalPipe,
    Findings,
  ],
  templateUrl: './wire-fuse.html',
  styleUrl: './wire-fuse.scss',
})
export class WireFuse {
  /** A circuit to start from; its current and voltage are filled in and stay editable. */
  readonly prefill = input<WireFusePrefill | undefined>(undefined);

  protected readonly gauges = AWG_SIZES;
  protected readonly voltages = SYSTEM_VOLTAGES;
  protected readonly insulationRatings = INSULATION_RATINGS_C;
  protected readonly cautions = WIRE_AND_FUSE_CAUTIONS;
  protected readonly placementRule = FUSE_PLACEMENT_RULE;
  protected readonly constructions: { value: ConductorConstruction; label: string }[] = [
    { value: 'stranded', label: 'Stranded (class B)' },
    { value: 'fine-stranded', label: 'Fine-stranded, flexible (class 5 / K)' },
    { value: 'solid', label: 'Solid' },
  ];
  protected readonly governedText: Record<string, string> = {
    'voltage-drop': 'voltage drop',
    ampacity: 'ampacity',
    'minimum-size': 'the minimum conductor size (33 CFR 183.425(d), (e))',
    'fuse-rating': 'fuse availability (the thinner gauges have no common fuse rating that protects them)',
  };
  protected readonly ruleSets: { value: ProtectionRules; label: string }[] = [
    { value: 'marine', label: 'Boat or vehicle (33 CFR 183, ABYC E-11)' },
    { value: 'nec', label: 'Cabin or building (NEC)' },
  ];

  protected readonly form = inject(FormBuilder).group({
    currentA: [null as number | null, [Validators.required, Validators.min(0.1), Validators.max(1000)]],
    oneWayLengthM: [null as number | null, [Validators.required, Validators.min(0.1), Validators.max(100)]],
    systemVoltage: [12 as SystemVoltage, Validators.required],
    allowedDropPercent: [3 as 3 | 10, Validators.required],
    insulationRatingC: [105 as InsulationRatingC, Validators.required],
    construction: [WIRE_FUSE_DEFAULTS.construction],
    conductorTemperatureC: requiredNumber(WIRE_FUSE_DEFAULTS.conductorTemperatureC, -40, 105),
    rules: [WIRE_FUSE_DEFAULTS.rules],
    ambientC: requiredNumber(WIRE_FUSE_DEFAULTS.ambientC, -40, 100),
    engineSpace: [WIRE_FUSE_DEFAULTS.engineSpace],
    bundledConductors: requiredNumber(WIRE_FUSE_DEFAULTS.bundledConductors, 1, 100),
    sheathed: [WIRE_FUSE_DEFAULTS.sheathed],
    fuseDistanceM: optionalNumber(0, 100),
    bankChemistry: ['lifepo4' as Chemistry | ''],
    bankCapacityAh: requiredNumber(100, 1, 20000),
    proposedGauge: ['' as AwgSize | ''],
    proposedFuseA: [null as number | null, [Validators.min(0.1), Validators.max(1000)]],
    fuseInterruptingRatingA: optionalNumber(1, 1_000_000),
  });
  private readonly formValue = toSignal(
    this.form.valueChanges.pipe(
      startWith(null),
      map(() => (this.form.valid ? (this.form.getRawValue() as WireFuseFormValue) : null)),
    ),
    { initialValue: null },
  );
  protected readonly outcome = computed(() => {
    const value = this.formValue();
    return value ? runWireFuseCheck(value) : null;
  });
  protected readonly result = computed(() => {
    const outcome = this.outcome();
    return outcome?.kind === 'result' ? outcome.result : null;
  });

  constructor() {
    effect(() => {
      const prefill = this.prefill();
      if (prefill) untracked(() => this.applyPrefill(prefill));
    });
  }

  /** "8 AWG · 8.37 mm² (metric: 10 mm²)" — the metric size an installer would buy instead. */
  protected sizeText(gauge: AwgSize | undefined): string {
    if (!gauge) return 'none of 18 AWG to 4/0 AWG';
    const size = conductorSize(gauge);
    const metric = size.metricAtLeastMm2 !== undefined ? `${size.metricAtLeastMm2} mm²` : 'above 120 mm²';
    return `${size.label} · ${size.areaMm2.toFixed(2)} mm² (metric: ${metric})`;
  }

  private applyPrefill(prefill: WireFusePrefill): void {
    // Rounded up to a tenth so the cable is never sized for less than the circuit carries.
    this.form.patchValue({
      currentA: Math.ceil(prefill.currentA * 10) / 10,
      systemVoltage: prefill.systemVoltage,
      ...(prefill.bank
        ? { bankChemistry: prefill.bank.chemistry, bankCapacityAh: prefill.bank.capacityAh }
        : {}),
    });
  }
}
