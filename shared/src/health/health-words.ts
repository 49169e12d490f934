// The battery's health in plain sentences for the screen and the report.
import { CapacityTrend, LifeCycleFigures } from './health-types';

/** Plain sentences about the capacity estimate and the life-cycle figures, numbers in `locale`. */
export function healthWords(trend: CapacityTrend, figures: LifeCycleFigures, locale: string): string[] {
  void trend;
  void figures;
  void locale;
  throw new Error('healthWords: implementation lands in the next commit');
}
