import { DecimalPipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  LOCALE_ID,
  computed,
  inject,
  input,
  signal,
} from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import type { EnergyBudgetComparison, EnergyBudgetInput, SavedEnergyBudget } from '@cellwarden/shared';
import type { ChartConfiguration } from 'chart.js';
import { combineLatest, of, switchMap } from 'rxjs';
import { LoadState, loadedOr, toLoadState } from '../../../core/load-state';
import { Api } from '../../../core/api';
import { serverErrorOf } from '../../../core/api-error';
import { EnergyBudgetsApi } from '../energy-budgets-api';
import { comparedDays, describeBudgetGap, formatDay } from './budget-gap';
import { toComparisonChart } from './to-comparison-chart';

/**
 * The budget saved for a system against what the system measured over the last week: a chart per day, the
 * figures per day and the gap in words. Saving the editor's budget for a system is offered here too.
 */
import { ChartFigure } from '../../../core/chart-figure/chart-figure';

@Component({
  selector: 'cw-budget-comparison',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    FormsModule,
    DecimalPipe,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatTableModule,
    ChartFigure,
  ],
  templateUrl: './budget-comparison.html',
  styleUrl: './budget-comparison.scss',
})
export class BudgetComparison {
  private readonly api = inject(Api);
  private readonly budgets = inject(EnergyBudgetsApi);
  private readonly locale = inject(LOCALE_ID);

  /** The editor's budget when it is valid, to save for a system. */
  readonly budgetInput = input<EnergyBudgetInput | null>(null);

  protected readonly systems = toSignal(this.api.systems(), { initialValue: [] });
  protected readonly chosenSystemId = signal<string | null>(null);
  protected readonly systemId = computed(() => this.chosenSystemId() ?? this.systems()[0]?.id ?? null);
  protected readonly budgetName = signal('Planned budget');
  protected readonly saving = signal(false);
  protected readonly saveProblem = signal<string | null>(null);
  private readonly reloads = signal(0);
  protected readonly saved = toSignal<LoadState<SavedEnergyBudget[]> | null>(
    combineLatest([toObservable(this.systemId), toObservable(this.reloads)]).pipe(
      switchMap(([id]) =>
        id ? toLoadState(this.budgets.list(id), 'The saved budgets could not be loaded.') : of(null),
      ),
    ),
    { initialValue: null },
  );
  protected readonly savedList = computed(() => {
    const state = this.saved();
    return state ? loadedOr(state, []) : [];
  });
  protected readonly savedError = computed(() => {
    const state = this.saved();
    return state?.status === 'error' ? state.message : null;
  });
  protected readonly chosenBudgetId = signal<string | null>(null);
  protected readonly budgetId = computed(() => {
    const list = this.savedList();
    const chosen = this.chosenBudgetId();
    return list.find((b) => b.id === chosen)?.id ?? list[0]?.id ?? null;
  });
  protected readonly comparison = toSignal<LoadState<EnergyBudgetComparison> | null>(
    combineLatest([toObservable(this.systemId), toObservable(this.budgetId)]).pipe(
      // A system without a saved budget has nothing to compare: the last system's figures leave with it.
      switchMap(([systemId, budgetId]) =>
        systemId && budgetId
          ? toLoadState(this.budgets.comparison(systemId, budgetId), 'The comparison could not be loaded.')
          : of(null),
      ),
    ),
    { initialValue: null },
  );
  protected readonly comparisonError = computed(() => {
    const state = this.comparison();
    return state?.status === 'error' ? state.message : null;
  });
  protected readonly measured = computed(() => {
    const state = this.comparison();
    return state?.status === 'loaded' ? state.value : null;
  });
  protected readonly days = computed(() => {
    const measured = this.measured();
    return measured ? comparedDays(measured) : [];
  });
  protected readonly gapText = computed(() => {
    const measured = this.measured();
    return measured ? describeBudgetGap(measured, this.locale) : '';
  });
  protected readonly chartData = computed(() => toComparisonChart(this.days(), this.locale));
  protected readonly chartOptions: ChartConfiguration['options'] = {
    responsive: true,
    maintainAspectRatio: false,
    scales: { y: { beginAtZero: true, title: { display: true, text: 'Wh per day' } } },
  };
  protected readonly columns = ['day', 'measuredOut', 'plannedOut', 'outGap', 'measuredIn', 'plannedIn'];
  protected readonly dayLabel = (day: string) => formatDay(day, this.locale);

  /** Saves the editor's budget for the chosen system; the comparison follows with it. */
  protected saveBudget(): void {
    const systemId = this.systemId();
    const budget = this.budgetInput();
    const name = this.budgetName().trim();
    if (!systemId || !budget) return;
    if (!name) {
      this.saveProblem.set('Budget name is required.');
      return;
    }
    this.saving.set(true);
    this.saveProblem.set(null);
    this.budgets.save(systemId, name, budget).subscribe({
      next: (saved) => {
        this.saving.set(false);
        this.chosenBudgetId.set(saved.id);
        this.reloads.update((n) => n + 1);
      },
      error: (error: unknown) => {
        this.saving.set(false);
        this.saveProblem.set(serverErrorOf(error, 'The budget could not be saved.').message);
      },
    });
  }
}
