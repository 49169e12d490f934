import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { EnergyBudgetComparison, EnergyBudgetInput, SavedEnergyBudget } from '@cellwarden/shared';
import { Observable, map } from 'rxjs';
import { systemPath } from '../../core/api';

/** Energy budgets saved for a system, and how one compares with what the system measured. */
@Injectable({ providedIn: 'root' })
export class EnergyBudgetsApi {
  private readonly http = inject(HttpClient);

  /** The system's saved budgets, most recently changed first. */
  list(systemId: string): Observable<SavedEnergyBudget[]> {
    return this.http
      .get<{ budgets: SavedEnergyBudget[] }>(systemPath(systemId, '/energy-budgets'))
      .pipe(map((body) => body.budgets));
  }

  /** Saves a budget for the system (configure access), or replaces `budgetId`'s. */
  save(
    systemId: string,
    name: string,
    budget: EnergyBudgetInput,
    budgetId?: string,
  ): Observable<SavedEnergyBudget> {
    const body = { name, budget };
    const request = budgetId
      ? this.http.put<{ budget: SavedEnergyBudget }>(
          systemPath(systemId, `/energy-budgets/${encodeURIComponent(budgetId)}`),
          body,
        )
      : this.http.post<{ budget: SavedEnergyBudget }>(systemPath(systemId, '/energy-budgets'), body);
    return request.pipe(map((answer) => answer.budget));
  }

  /** The budget against the measured energy of the last `days` whole days (UTC). */
  comparison(systemId: string, budgetId: string, days = 7): Observable<EnergyBudgetComparison> {
    return this.http
      .get<{ comparison: EnergyBudgetComparison }>(
        systemPath(systemId, `/energy-budgets/${encodeURIComponent(budgetId)}/comparison`),
        { params: { days } },
      )
      .pipe(map((body) => body.comparison));
  }
}
