import {
  ChangeDetectionStrategy,
  Component,
  booleanAttribute,
  computed,
  input,
  viewChild,
} from '@angular/core';
import type { ChartConfiguration, ChartType, DefaultDataPoint } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';

/**
 * A chart as every screen draws it: an optional caption, the canvas as an image named by what it shows and a
 * sentence summarising its values (a canvas says nothing to a screen reader), and that sentence again as
 * hidden text where the screen wants it. The screen lists `provideChartSetup(...)` in its providers (with any
 * plugins it needs) and sizes the chart with `--cw-chart-height` on this element.
 */
@Component({
  selector: 'cw-chart-figure',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [BaseChartDirective],
  template: `
    <figure>
      @if (caption(); as text) {
        <figcaption>{{ text }}</figcaption>
      }
      <div class="chart">
        <canvas
          baseChart
          role="img"
          [type]="type()"
          [attr.aria-label]="accessibleName()"
          [data]="data()"
          [options]="options()"
        ></canvas>
      </div>
      @if (summaryAsText()) {
        <p class="cw-visually-hidden">{{ summary() }}</p>
      }
    </figure>
  `,
  styles: `
    :host {
      display: block;
      min-width: 0;
    }
    figure {
      margin: 0;
    }
    figcaption {
      font: var(--mat-sys-title-small);
      margin-bottom: 4px;
    }
    .chart {
      position: relative;
      height: var(--cw-chart-height, 280px);
    }
  `,
})
export class ChartFigure<TType extends ChartType = ChartType, TData = DefaultDataPoint<TType>> {
  /** The chart.js chart type: 'line', 'bar'. */
  readonly type = input.required<TType>();
  /** The data; build it in a `computed` so a change gives a new object and the chart redraws. */
  readonly data = input.required<ChartConfiguration<TType, TData>['data']>();
  /** The chart.js options, plugins' options (zoom, annotation) included. */
  readonly options = input<ChartConfiguration<TType, TData>['options']>();
  /** A visible caption above the chart; none where a heading already names it. */
  readonly caption = input<string>();
  /** What the chart shows, the start of its accessible name, with its own closing mark ('Chart of voltage.'). */
  readonly name = input.required<string>();
  /** One sentence on the values drawn, read after the name. */
  readonly summary = input.required<string>();
  /** Also writes the summary into the page, visually hidden, for screen readers read line by line. */
  readonly summaryAsText = input(false, { transform: booleanAttribute });

  /** The ng2-charts directive, for chart.js calls a screen makes itself (a plugin's `resetZoom`, an image). */
  readonly chart = viewChild.required<BaseChartDirective<TType, TData>>(BaseChartDirective);

  protected readonly accessibleName = computed(() => `${this.name()} ${this.summary()}`);
}
