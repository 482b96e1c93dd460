import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  linkedSignal,
  untracked,
} from '@angular/core';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatOption, MatSelect } from '@angular/material/select';
import { Legend, type ChartData, type ChartOptions } from 'chart.js';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import { ChartFrame } from '../../ui/chart-frame/chart-frame';
import { CHART_GRID, CHART_INK, CHART_LIMIT_INK } from '../../ui/chart-frame/chart-inks';
import { DAY_MS, dayAxis, dayMs, lotDayTitle } from '../../ui/chart-frame/day-axis';
import { provideLineChart } from '../../ui/chart-frame/line-chart-parts';
import { LoadState } from '../../ui/load-state/load-state';
import { FormulaOptions } from '../formula-options';
import { NitriteHistory } from './nitrite-history';
import { nitriteSummary } from './nitrite-points';

/**
 * Ingoing nitrite of each recorded batch of one cure formula over time, with the formula's
 * ceiling drawn as a line: a drift towards the limit shows at a glance. Time runs to scale (a
 * fortnight without batches is a gap, not one step). The same figures are in a table for screen
 * readers, and summed up in words under the chart.
 */
@Component({
  selector: 'app-nitrite-chart',
  imports: [ChartFrame, LoadState, MatFormField, MatLabel, MatSelect, MatOption, IsoDayPipe],
  providers: [NitriteHistory, provideLineChart(Legend)],
  templateUrl: './nitrite-chart.html',
  styleUrl: './nitrite-chart.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NitriteChart {
  protected readonly history = inject(NitriteHistory);
  protected readonly formulaOptions = inject(FormulaOptions);

  /** The cure formula to show first. */
  readonly initialFormula = input<string | null>(null);

  /** The cure formula shown; follows the initial one until another is chosen. */
  protected readonly formula = linkedSignal(() => this.initialFormula());
  protected readonly title = computed(() => {
    const id = this.formula();
    return id ? this.formulaOptions.titleOf(id) : '';
  });
  protected readonly points = this.history.points;
  protected readonly summary = computed(() => nitriteSummary(this.points(), this.title()));
  // The batches in blue, solid, with points; the limit in red, dashed, with none: apart by hue and
  // by style.
  protected readonly data = computed<ChartData<'line'>>(() => {
    const points = this.points();
    return {
      datasets: [
        {
          label: 'Ingoing nitrite of each batch (ppm)',
          data: points.map((p) => ({ x: dayMs(p.day), y: p.ppm })),
          borderColor: CHART_INK,
          backgroundColor: CHART_INK,
          borderWidth: 2,
          pointBackgroundColor: points.map((p) => (p.over ? CHART_LIMIT_INK : CHART_INK)),
          pointStyle: points.map((p) => (p.over ? 'triangle' : 'circle')),
          pointRadius: points.map((p) => (p.over ? 7 : 4)),
          pointHoverRadius: 7,
          tension: 0,
        },
        {
          label: 'Limit (ppm)',
          data: points.map((p) => ({ x: dayMs(p.day), y: p.limit })),
          borderColor: CHART_LIMIT_INK,
          backgroundColor: CHART_LIMIT_INK,
          borderDash: [8, 5],
          borderWidth: 2,
          pointRadius: 0,
          pointHoverRadius: 0,
          pointStyle: 'line',
          // A limit holds until the batch that was checked against another one.
          stepped: true,
        },
      ],
    };
  });
  protected readonly options = computed<ChartOptions<'line'>>(() => {
    const points = this.points();
    const top = Math.max(0, ...points.map((p) => Math.max(p.ppm, p.limit ?? 0)));
    const first = points.length ? dayMs(points[0].day) : 0;
    const last = points.length ? dayMs(points[points.length - 1].day) : 0;
    // One batch, or all on one day: a day either side, so the point is not on the edge.
    const pad = last > first ? 0 : DAY_MS;
    return {
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      interaction: { mode: 'nearest', axis: 'x', intersect: false },
      scales: {
        y: {
          beginAtZero: true,
          suggestedMax: Math.ceil((top * 1.1) / 10) * 10,
          title: { display: true, text: 'ppm of green weight' },
          grid: { color: CHART_GRID },
        },
        x: dayAxis(first - pad, last + pad, 'Day recorded (to scale)', { maxTicksLimit: 8 }),
      },
      plugins: {
        legend: { position: 'bottom', labels: { usePointStyle: true } },
        tooltip: {
          callbacks: {
            title: (items) => lotDayTitle(points[items[0]?.dataIndex ?? 0]),
            label: (item) => `${item.dataset.label ?? ''}: ${Number(item.parsed.y).toFixed(1)}`,
          },
        },
      },
    };
  });

  constructor() {
    void this.formulaOptions.load();
    effect(() => {
      const id = this.formula();
      if (id) untracked(() => void this.history.load(id));
    });
  }

  protected choose(id: string): void {
    this.formula.set(id);
  }

  protected retry(): void {
    const id = this.formula();
    if (id) void this.history.load(id);
  }
}
