import type { Provider } from '@angular/core';
import type { ChartComponentLike } from 'chart.js';
import 'chartjs-adapter-date-fns';
import { provideCharts, withDefaultRegisterables } from 'ng2-charts';

/**
 * Chart.js with its controllers and the date adapter, for the features that draw charts (live, history, energy
 * budget): each lists this in its component providers, so chart.js loads with the first chart, not the app.
 * A feature that needs chart.js plugins (history: annotation and zoom) passes them here, so they are registered
 * with the rest and load only with that feature.
 */
export function provideChartSetup(...plugins: ChartComponentLike[]): Provider {
  return provideCharts(withDefaultRegisterables(...plugins));
}
