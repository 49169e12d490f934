import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import {
  AWG_SIZES,
  AwgSize,
  INSULATION_RATINGS_C,
  InsulationRatingC,
  SYSTEM_VOLTAGES,
  SystemVoltage,
  WIRE_AND_FUSE_CAUTIONS,
  conductorSize,
} from '@cellwarden/shared';
import { map, startWith } from 'rxjs';
import { Findings } from '../findings/findings';
import { WireFuseFormValue, runWireFuseCheck } from './wire-fuse-adapter';

/** The wire & fuse check: conductor size by drop and by ampacity, the fuse range, and a verdict, live. */
@Component({
  selector: 'cw-wire-fuse',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonToggleModule,
    MatIconModule,
    DecimalPipe,
    Findings,
  ],
  templateUrl: './wire-fuse.html',
  styleUrl: './wire-fuse.scss',
})
export class WireFuse {
  protected readonly gauges = AWG_SIZES;
  protected readonly voltages = SYSTEM_VOLTAGES;
  protected readonly insulationRatings = INSULATION_RATINGS_C;
  protected readonly cautions = WIRE_AND_FUSE_CAUTIONS;

  protected readonly form = inject(FormBuilder).group({
    currentA: [null as number | null, [Validators.required, Validators.min(0.1), Validators.max(1000)]],
    oneWayLengthM: [null as number | null, [Validators.required, Validators.min(0.1), Validators.max(100)]],
    systemVoltage: [12 as SystemVoltage, Validators.required],
    allowedDropPercent: [3 as 3 | 10, Validators.required],
    insulationRatingC: [105 as InsulationRatingC, Validators.required],
    proposedGauge: ['' as AwgSize | ''],
    proposedFuseA: [null as number | null, [Validators.min(0.1), Validators.max(1000)]],
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

  /** "8 AWG · 8.37 mm² (metric: 10 mm²)" — the metric size an installer would buy instead. */
  protected sizeText(gauge: AwgSize | undefined): string {
    if (!gauge) return 'none of 18 AWG to 4/0 AWG';
    const size = conductorSize(gauge);
    const metric = size.metricAtLeastMm2 !== undefined ? `${size.metricAtLeastMm2} mm²` : 'above 120 mm²';
    return `${size.label} · ${size.areaMm2.toFixed(2)} mm² (metric: ${metric})`;
  }
}
