import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import {
  Chart,
  LineController,
  LineElement,
  LinearScale,
  PointElement,
  Tooltip,
  type ChartData,
  type ChartOptions,
} from 'chart.js';
import { BaseChartDirective, provideCharts } from 'ng2-charts';
import { dayWords } from '../../../../shared/presentation/date-words.ts';
import { messageOf } from '../../core/api/message-of';
import { SessionStore } from '../../core/auth/session-store';
import { DAY_MS, axisDayWords, dayMs } from '../../batches/nitrite-chart/nitrite-points';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import { CostApi } from '../cost-api';
import { costPoints, costSummary, type CostPoint } from './cost-points';

Chart.defaults.font.family = 'Fira Sans';

// As the nitrite chart (batches/nitrite-chart): a canvas cannot read CSS custom properties. Batches
// priced in full in blue circles; those priced in part in hollow triangles, apart by shape too.
const INK = '#1f5fa8';
const GRID = '#e8e0da';

/**
 * A formula's cost per finished kilogram, one point a batch by the day it started, for admins
 * and reviewers: a dearer delivery shows as a step. Time runs to scale. The same figures are in
 * a table for screen readers and summed up in words under the chart.
 */
@Component({
  selector: 'app-formula-cost-chart',
  imports: [BaseChartDirective, IsoDayPipe],
  providers: [
    provideCharts({
      registerables: [LineController, LineElement, PointElement, LinearScale, Tooltip],
    }),
  ],
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
  protected readonly points = signal<readonly CostPoint[] | null>(null);
  protected readonly truncated = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly summary = computed(() => costSummary(this.points() ?? []));
  protected readonly data = computed<ChartData<'line'>>(() => {
    const points = this.points() ?? [];
    return {
      datasets: [
        {
          label: 'Cost per finished kg of each batch',
          data: points.map((p) => ({ x: dayMs(p.day), y: p.perKg })),
          borderColor: INK,
          backgroundColor: points.map((p) => (p.complete ? INK : '#ffffff')),
          pointBorderColor: INK,
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
          grid: { color: GRID },
        },
        x: {
          type: 'linear',
          min: first - pad,
          max: last + pad,
          title: { display: true, text: 'Day the batch started (to scale)' },
          grid: { color: GRID },
          ticks: {
            stepSize: step,
            maxRotation: 0,
            callback: (value) => axisDayWords(Number(value), first - pad, last + pad),
          },
        },
      },
      plugins: {
        legend: { display: false },
        tooltip: {
          callbacks: {
            title: (items) => {
              const point = points[items[0]?.dataIndex ?? 0];
              return point ? `${point.lot} · ${dayWords(point.day)}` : '';
            },
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
  private request = 0;

  constructor() {
    effect(() => {
      const id = this.formulaId();
      if (this.shown()) untracked(() => void this.load(id));
    });
  }

  private async load(id: string): Promise<void> {
    const request = ++this.request;
    this.points.set(null);
    this.error.set(null);
    try {
      const costs = await this.api.formulaCosts(id);
      if (request !== this.request) return;
      this.points.set(costPoints(costs.points));
      this.truncated.set(costs.truncated);
    } catch (error) {
      if (request === this.request) this.error.set(messageOf(error));
    }
  }
}
