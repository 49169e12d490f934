import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import {
  compareBudgetWithActual,
  energyBudget,
  type EnergyBudgetComparison,
  type EnergyBudgetInput,
  type SavedEnergyBudget,
} from '@cellwarden/shared';
import { provideCharts, withDefaultRegisterables } from 'ng2-charts';
import { toBudgetInput } from '../to-budget-input';
import { BudgetComparison } from './budget-comparison';

const INPUT: EnergyBudgetInput = toBudgetInput({
  loads: [{ name: 'Fridge', watts: 45, ac: false, hoursPerDay: 24, dutyPercent: 40 }],
  sources: [{ kind: 'solar', rating: 200, hours: 4 }],
  system: {
    nominalVoltage: 12,
    inverterEfficiencyPercent: 90,
    inverterRatedW: 0,
    bmsContinuousA: 100,
    usablePercent: 90,
    daysOfAutonomy: 2,
    batteryCapacityAh: null,
    chemistry: 'lifepo4',
    inverterStandbyW: 0,
    inverterStandbyHoursPerDay: 24,
    inverterSurgeW: null,
    bmsPeakA: null,
  },
});
const SAVED: SavedEnergyBudget = { id: 'b1', name: 'Winter plan', budget: INPUT, createdAt: 0, updatedAt: 0 };
const SYSTEMS = [
  { id: 'van', name: 'Winter van' },
  { id: 'cabin', name: 'Lake cabin' },
];

function comparison(perDay: { day: string; whIn: number; whOut: number }[]): EnergyBudgetComparison {
  const budget = energyBudget(INPUT);
  const whIn = perDay.reduce((sum, d) => sum + d.whIn, 0);
  const whOut = perDay.reduce((sum, d) => sum + d.whOut, 0);
  return {
    budget,
    days: 7,
    measured: { whIn, whOut, perDay },
    comparison: compareBudgetWithActual(budget, { whIn, whOut, days: 7 }),
  };
}

describe('BudgetComparison', () => {
  beforeEach(() => {
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
    const error = console.error.bind(console);
    jest.spyOn(console, 'error').mockImplementation((...args: unknown[]) => {
      if (!/acquire context/.test(String(args[0]))) error(...args);
    });
    TestBed.configureTestingModule({
      imports: [BudgetComparison],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideCharts(withDefaultRegisterables()),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
  });
  afterEach(() => jest.restoreAllMocks());

  async function render(budgets: SavedEnergyBudget[]) {
    const fixture = TestBed.createComponent(BudgetComparison);
    fixture.componentRef.setInput('budgetInput', INPUT);
    const http = TestBed.inject(HttpTestingController);
    await fixture.whenStable();
    http.expectOne('/api/systems').flush({ systems: SYSTEMS });
    await fixture.whenStable();
    http.expectOne('/api/systems/van/energy-budgets').flush({ budgets });
    await fixture.whenStable();
    const text = () => ((fixture.nativeElement as HTMLElement).textContent ?? '').replace(/\s+/g, ' ');
    return { fixture, http, text, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('compares the saved budget with the measured days: in words, per day in a table', async () => {
    const { fixture, http, text, loader } = await render([SAVED]);
    // The example budget plans 640 Wh in and 432 Wh out a day (worked in energy-budget.spec.ts).
    http
      .expectOne((r) => r.url === '/api/systems/van/energy-budgets/b1/comparison')
      .flush({
        comparison: comparison(
          Array.from({ length: 7 }, (_, i) => ({
            day: `2026-11-${String(24 + i).padStart(2, '0')}`,
            whIn: 640,
            whOut: i === 3 ? 1432 : 432,
          })),
        ),
      });
    await fixture.whenStable();
    // (6 × 432 + 1432) / 7 = 574.9 Wh/day: 143 more than 432; the gap of 1,000 Wh is on Fri 27 Nov.
    expect(text()).toContain('Used 143 Wh/day more than planned (575 against 432 Wh/day)');
    expect(text()).toContain('the largest gap is on Fri, Nov 27 (+1,000 Wh used)');
    expect(text()).toContain('Charged about what was planned (640 against 640 Wh/day)');
    const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['measuredOut'].text[3]).toBe('1,432 Wh');
    expect(cells['outGap'].text[3]).toBe('+1,000 Wh');
    expect(cells['outGap'].text[0]).toBe('0 Wh');
  });

  it('offers to save the editor’s budget when none is saved, then compares it', async () => {
    const { fixture, http, text, loader } = await render([]);
    expect(text()).toContain('No budget is saved for this system yet.');
    await (
      await loader.getHarness(MatButtonHarness.with({ text: 'Save this budget for the system' }))
    ).click();
    const save = http.expectOne({ method: 'POST', url: '/api/systems/van/energy-budgets' });
    expect(save.request.body).toEqual({ name: 'Planned budget', budget: INPUT });
    save.flush({ budget: SAVED });
    await fixture.whenStable();
    http.expectOne('/api/systems/van/energy-budgets').flush({ budgets: [SAVED] });
    await fixture.whenStable();
    http
      .expectOne((r) => r.url.endsWith('/energy-budgets/b1/comparison'))
      .flush({ comparison: comparison([]) });
    await fixture.whenStable();
    expect(text()).toContain('No readings in the last 7 days to compare the budget with.');
  });

  it('says why saving was refused and follows the chosen system', async () => {
    const { fixture, http, text, loader } = await render([]);
    await (
      await loader.getHarness(MatButtonHarness.with({ text: 'Save this budget for the system' }))
    ).click();
    http
      .expectOne({ method: 'POST' })
      .flush(
        { error: { code: 'forbidden', message: 'Your access to this system does not include "configure"' } },
        { status: 403, statusText: 'Forbidden' },
      );
    await fixture.whenStable();
    expect(text()).toContain('does not include "configure"');
    await (await loader.getHarness(MatSelectHarness)).clickOptions({ text: 'Lake cabin' });
    http.expectOne('/api/systems/cabin/energy-budgets').flush({ budgets: [] });
  });
});
