import type { Provider } from '@angular/core';
import 'chartjs-adapter-date-fns';
import { provideCharts, withDefaultRegisterables } from 'ng2-charts';

/**
 * Chart.js with its controllers and the date adapter, for the features that draw charts (live, history, energy
 * budget): each lists this in its component providers, so chart.js loads with the first chart, not the app.
 */
export function provideChartSetup(): Provider {
  return provideCharts(withDefaultRegisterables());
}
