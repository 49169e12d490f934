import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormArray, FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import {
  BudgetCircuit,
  Chemistry,
  InstallerInputError,
  SYSTEM_VOLTAGES,
  SystemVoltage,
  energyBudget,
} from '@cellwarden/shared';
import type { ChartConfiguration } from 'chart.js';
import { provideChartSetup } from '../../core/chart-setup';
import { map, startWith } from 'rxjs';
import { Findings } from '../findings/findings';
import { BudgetComparison } from './budget-comparison/budget-comparison';
import { WireFuse, WireFusePrefill } from '../wire-fuse/wire-fuse';
import { budgetChartSummary, toBudgetChart } from './to-budget-chart';
import { BudgetEditorValue, LoadRow, SourceRow, toBudgetInput } from './to-budget-input';

const num = (value: number, min: number, max: number) => [
  value,
  [Validators.required, Validators.min(min), Validators.max(max)],
];

/** The energy budget editor: load and source rows, the battery system, and the daily balance live. */
import { ChartFigure } from '../../core/chart-figure/chart-figure';

@Component({
  selector: 'cw-energy-budget',
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [provideChartSetup()],
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatCheckboxModule,
    MatButtonModule,
    MatIconModule,
    DecimalPipe,
    ChartFigure,
    Findings,
    WireFuse,
    BudgetComparison,
  ],
  templateUrl: './energy-budget.html',
  styleUrl: './energy-budget.scss',
})
export class EnergyBudgetEditor {
  private readonly fb = inject(FormBuilder);

  protected readonly voltages = SYSTEM_VOLTAGES;
  /** The circuit whose wire and fuse check is open below the budget. */
  protected readonly checkedCircuit = signal<WireFusePrefill | undefined>(undefined);
  protected readonly form = this.fb.nonNullable.group({
    loads: this.fb.array([
      this.loadGroup({ name: 'Fridge', watts: 45, ac: false, hoursPerDay: 24, dutyPercent: 40 }),
    ]),
    sources: this.fb.array([this.sourceGroup({ kind: 'solar', rating: 200, hours: 4 })]),
    system: this.fb.nonNullable.group({
      nominalVoltage: [12 as SystemVoltage],
      inverterEfficiencyPercent: num(90, 50, 100),
      inverterRatedW: num(0, 0, 20000),
      bmsContinuousA: num(100, 1, 2000),
      usablePercent: num(90, 1, 100),
      daysOfAutonomy: num(2, 0.5, 30),
      batteryCapacityAh: [null as number | null, [Validators.min(1), Validators.max(20000)]],
      chemistry: ['lifepo4' as Chemistry],
      inverterStandbyW: num(0, 0, 1000),
      inverterStandbyHoursPerDay: num(24, 0, 24),
      inverterSurgeW: [null as number | null, [Validators.min(0), Validators.max(60000)]],
      bmsPeakA: [null as number | null, [Validators.min(1), Validators.max(10000)]],
    }),
  });
  private readonly value = toSignal(
    this.form.valueChanges.pipe(
      startWith(null),
      map(() => (this.form.valid ? (this.form.getRawValue() as BudgetEditorValue) : null)),
    ),
    { initialValue: null },
  );
  protected readonly outcome = computed(() => {
    const value = this.value();
    if (!value) return { kind: 'invalid' as const };
    try {
      return { kind: 'budget' as const, budget: energyBudget(toBudgetInput(value)) };
    } catch (error) {
      if (error instanceof InstallerInputError) return { kind: 'refused' as const, message: error.message };
      throw error;
    }
  });
  protected readonly budget = computed(() => {
    const outcome = this.outcome();
    return outcome.kind === 'budget' ? outcome.budget : null;
  });
  /** The budget as the API takes it, when it is valid, for saving it with a system. */
  protected readonly budgetInput = computed(() => {
    const value = this.value();
    return this.budget() && value ? toBudgetInput(value) : null;
  });
  protected readonly chartData = computed(() => {
    const budget = this.budget();
    return budget ? toBudgetChart(budget.whStoredPerDay, budget.whOutPerDay) : null;
  });
  protected readonly chartSummary = computed(() => {
    const budget = this.budget();
    return budget ? budgetChartSummary(budget.whStoredPerDay, budget.whOutPerDay) : '';
  });
  protected readonly chartOptions: ChartConfiguration<'bar'>['options'] = {
    responsive: true,
    maintainAspectRatio: false,
    plugins: { legend: { display: false } },
    scales: { y: { beginAtZero: true, title: { display: true, text: 'Wh per day' } } },
  };

  protected get loads(): FormArray {
    return this.form.controls.loads;
  }

  protected get sources(): FormArray {
    return this.form.controls.sources;
  }

  /** Opens the wire and fuse check for one of the budget's circuits, prefilled with its DC current. */
  protected checkCircuit(circuit: BudgetCircuit): void {
    const system = this.form.controls.system.getRawValue();
    this.checkedCircuit.set({
      circuit: circuit.name,
      currentA: circuit.currentA,
      systemVoltage: system.nominalVoltage,
      ...(system.batteryCapacityAh
        ? { bank: { chemistry: system.chemistry, capacityAh: system.batteryCapacityAh } }
        : {}),
    });
  }

  protected addLoad(): void {
    this.form.controls.loads.push(
      this.loadGroup({ name: '', watts: 0, ac: false, hoursPerDay: 1, dutyPercent: 100 }),
    );
  }

  protected removeLoad(index: number): void {
    this.form.controls.loads.removeAt(index);
  }

  protected addSource(): void {
    this.form.controls.sources.push(this.sourceGroup({ kind: 'solar', rating: 100, hours: 4 }));
  }

  protected removeSource(index: number): void {
    this.form.controls.sources.removeAt(index);
  }

  private loadGroup(row: LoadRow) {
    return this.fb.nonNullable.group({
      name: [row.name, [Validators.required, Validators.maxLength(60)]],
      watts: num(row.watts, 0, 20000),
      ac: [row.ac],
      hoursPerDay: num(row.hoursPerDay, 0, 24),
      dutyPercent: num(row.dutyPercent, 0, 100),
    });
  }

  private sourceGroup(row: SourceRow) {
    return this.fb.nonNullable.group({
      kind: [row.kind],
      rating: num(row.rating, 0, 20000),
      hours: num(row.hours, 0, 24),
    });
  }
}
