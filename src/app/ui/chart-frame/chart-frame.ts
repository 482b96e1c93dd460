import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { Chart, type ChartData, type ChartOptions } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';

// The console's own font in every chart, set once for all of them.
Chart.defaults.font.family = 'Fira Sans';

/**
 * A line chart in its figure: the canvas at a fixed height (never pushing the page sideways while
 * it redraws after a resize), named for screen readers by its summary, with the caption projected
 * under it. The Chart.js parts it draws with come from the component that uses the frame
 * (`provideLineChart` in its providers), so each screen loads only what it draws.
 */
@Component({
  selector: 'app-chart-frame',
  imports: [BaseChartDirective],
  templateUrl: './chart-frame.html',
  styleUrl: './chart-frame.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '[class.small]': 'small()' },
})
export class ChartFrame {
  readonly data = input.required<ChartData<'line', unknown[]>>();
  readonly options = input.required<ChartOptions<'line'>>();
  /** The chart in one sentence: its name for those who cannot see it. */
  readonly summary = input.required<string>();
  /** The canvas's height, px. */
  readonly height = input(240);
  /** A caption in small print, for a chart among others on a busy screen. */
  readonly small = input(false);
  /** The test id of the canvas. */
  readonly testId = input<string | null>(null);
}
