import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import type { ChartData, ChartOptions } from 'chart.js';
import { SessionStore } from '../../core/auth/session-store';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import { ChartFrame } from '../../ui/chart-frame/chart-frame';
import { CHART_GRID, CHART_INK } from '../../ui/chart-frame/chart-inks';
import { DAY_MS, dayAxis, dayMs, lotDayTitle } from '../../ui/chart-frame/day-axis';
import { provideLineChart } from '../../ui/chart-frame/line-chart-parts';
import { latestRead } from '../../ui/latest-read';
import { LoadState } from '../../ui/load-state/load-state';
import { CostApi } from '../cost-api';
import { costPoints, costSummary } from './cost-points';

/**
 * A formula's cost per finished kilogram, one point a batch by the day it started, for admins
 * and reviewers: a dearer delivery shows as a step. Time runs to scale. The same figures are in
 * a table for screen readers and summed up in words under the chart. Batches priced in full are
 * blue circles; those priced in part hollow triangles, apart by shape too.
 */
@Component({
  selector: 'app-formula-cost-chart',
  imports: [ChartFrame, IsoDayPipe, LoadState],
  providers: [provideLineChart()],
  templateUrl: './formula-cost-chart.html',
  styleUrl: './formula-cost-chart.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FormulaCostChart {
  private readonly api = inject(CostApi);
  private readonly session = inject(SessionStore);

  /** The formula's id. */
  readonly formulaId = input.required<string>();

  protected readonly shown = computed(() => this.session.hasRole('admin', 'reviewer'));
  protected readonly costs = latestRead(
    () => (this.shown() ? this.formulaId() : null),
    (id: string) => this.api.formulaCosts(id),
  );
  protected readonly points = computed(() => {
    const costs = this.costs.value();
    return costs ? costPoints(costs.points) : null;
  });
  protected readonly summary = computed(() => costSummary(this.points() ?? []));
  protected readonly data = computed<ChartData<'line'>>(() => {
    const points = this.points() ?? [];
    return {
      datasets: [
        {
          label: 'Cost per finished kg of each batch',
          data: points.map((p) => ({ x: dayMs(p.day), y: p.perKg })),
          borderColor: CHART_INK,
          backgroundColor: points.map((p) => (p.complete ? CHART_INK : '#ffffff')),
          pointBorderColor: CHART_INK,
          pointStyle: points.map((p) => (p.complete ? 'circle' : 'triangle')),
          pointRadius: points.map((p) => (p.complete ? 4 : 6)),
          borderWidth: 2,
          tension: 0,
        },
      ],
    };
  });
  protected readonly options = computed<ChartOptions<'line'>>(() => {
    const points = this.points() ?? [];
    const first = points.length ? dayMs(points[0].day) : 0;
    const last = points.length ? dayMs(points[points.length - 1].day) : 0;
    // Whole days: a margin either side, so the first and last points are not cut by the edge,
    // and ticks a whole number of days apart, so each falls on the midnight it names.
    const spanDays = Math.round((last - first) / DAY_MS);
    const pad = Math.max(1, Math.ceil(spanDays * 0.03)) * DAY_MS;
    const step = Math.max(1, Math.ceil((spanDays + 2) / 5)) * DAY_MS;
    return {
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      scales: {
        y: {
          beginAtZero: true,
          grace: '10%',
          title: { display: true, text: 'per finished kg' },
          grid: { color: CHART_GRID },
        },
        x: dayAxis(first - pad, last + pad, 'Day the batch started (to scale)', {
          stepSize: step,
        }),
      },
      plugins: {
        legend: { display: false },
        tooltip: {
          callbacks: {
            title: (items) => lotDayTitle(points[items[0]?.dataIndex ?? 0]),
            label: (item) => {
              const point = points[item.dataIndex];
              return point
                ? `${point.perKgText} a finished kg${point.complete ? '' : ' (in part)'}`
                : '';
            },
          },
        },
      },
    };
  });
}
