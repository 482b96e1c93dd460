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
import { MatButton } from '@angular/material/button';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import {
  Chart,
  Legend,
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
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import { FormulaOptions } from '../formula-options';
import { NitriteHistory } from './nitrite-history';
import { DAY_MS, axisDayWords, dayMs, nitriteSummary } from './nitrite-points';

Chart.defaults.font.family = 'Fira Sans';

// A canvas cannot read CSS custom properties. The batches in blue, solid, with points; the limit
// in the error red of our palette (_theme-colors.scss), dashed, with none: apart by hue and by
// style, each 6.4:1 or more on white.
const INK = '#1f5fa8';
const LIMIT_INK = '#ba1a1a';
const GRID = '#e8e0da';

/**
 * Ingoing nitrite of each recorded batch of one cure formula over time, with the formula's
 * ceiling drawn as a line: a drift towards the limit shows at a glance. Time runs to scale (a
 * fortnight without batches is a gap, not one step). The same figures are in a table for screen
 * readers, and summed up in words under the chart.
 */
@Component({
  selector: 'app-nitrite-chart',
  imports: [
    BaseChartDirective,
    MatFormField,
    MatLabel,
    MatSelect,
    MatOption,
    MatButton,
    MatProgressBar,
    IsoDayPipe,
  ],
  providers: [
    NitriteHistory,
    provideCharts({
      registerables: [LineController, LineElement, PointElement, LinearScale, Tooltip, Legend],
    }),
  ],
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
  protected readonly data = computed<ChartData<'line'>>(() => {
    const points = this.points();
    return {
      datasets: [
        {
          label: 'Ingoing nitrite of each batch (ppm)',
          data: points.map((p) => ({ x: dayMs(p.day), y: p.ppm })),
          borderColor: INK,
          backgroundColor: INK,
          borderWidth: 2,
          pointBackgroundColor: points.map((p) => (p.over ? LIMIT_INK : INK)),
          pointStyle: points.map((p) => (p.over ? 'triangle' : 'circle')),
          pointRadius: points.map((p) => (p.over ? 7 : 4)),
          pointHoverRadius: 7,
          tension: 0,
        },
        {
          label: 'Limit (ppm)',
          data: points.map((p) => ({ x: dayMs(p.day), y: p.limit })),
          borderColor: LIMIT_INK,
          backgroundColor: LIMIT_INK,
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
          grid: { color: GRID },
        },
        x: {
          type: 'linear',
          min: first - pad,
          max: last + pad,
          title: { display: true, text: 'Day recorded (to scale)' },
          grid: { color: GRID },
          ticks: {
            maxTicksLimit: 8,
            maxRotation: 0,
            callback: (value) => axisDayWords(Number(value), first - pad, last + pad),
          },
        },
      },
      plugins: {
        legend: { position: 'bottom', labels: { usePointStyle: true } },
        tooltip: {
          callbacks: {
            title: (items) => {
              const point = points[items[0]?.dataIndex ?? 0];
              return point ? `${point.lot} · ${dayWords(point.day)}` : '';
            },
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
