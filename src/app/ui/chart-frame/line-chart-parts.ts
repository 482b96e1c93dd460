import type { Provider } from '@angular/core';
import {
  LineController,
  LineElement,
  LinearScale,
  PointElement,
  Tooltip,
  type ChartComponentLike,
} from 'chart.js';
import { provideCharts } from 'ng2-charts';

/**
 * The parts of Chart.js a line chart on a linear axis draws with (line, points, axis, tooltip),
 * and any more it needs (a legend, a fill, thinning), for a chart component's providers: each
 * screen loads only what it draws.
 */
export function provideLineChart(...more: ChartComponentLike[]): Provider {
  return provideCharts({
    registerables: [LineController, LineElement, PointElement, LinearScale, Tooltip, ...more],
  });
}
