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
  CategoryScale,
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
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';
import { FormulaOptions } from '../formula-options';
import { NitriteHistory } from './nitrite-history';
import { nitriteSummary } from './nitrite-points';

Chart.defaults.font.family = 'Fira Sans';

// A canvas cannot read CSS custom properties: these are tones of our palette (_theme-colors.scss).
const INK = '#974824';
const LIMIT_INK = '#ba1a1a';
const GRID = '#e8e0da';

const SHORT_DAY = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short' });

/**
 * Ingoing nitrite of each recorded batch of one cure formula over time, with the formula's
 * ceiling drawn as a line: a drift towards the limit shows at a glance. The same figures are in a
 * table for screen readers, and summed up in words under the chart.
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
      registerables: [
        LineController,
        LineElement,
        PointElement,
        LinearScale,
        CategoryScale,
        Tooltip,
        Legend,
      ],
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
      labels: points.map((p) => shortDay(p.day)),
      datasets: [
        {
          label: 'Ingoing nitrite (ppm)',
          data: points.map((p) => p.ppm),
          borderColor: INK,
          backgroundColor: INK,
          pointBackgroundColor: points.map((p) => (p.over ? LIMIT_INK : INK)),
          pointRadius: 4,
          pointHoverRadius: 6,
          tension: 0,
        },
        {
          label: 'Limit (ppm)',
          data: points.map((p) => p.limit),
          borderColor: LIMIT_INK,
          backgroundColor: LIMIT_INK,
          borderDash: [6, 4],
          borderWidth: 2,
          pointRadius: 0,
          pointHoverRadius: 0,
          pointStyle: 'line',
          stepped: true,
        },
      ],
    };
  });
  protected readonly options = computed<ChartOptions<'line'>>(() => {
    const points = this.points();
    const top = Math.max(0, ...points.map((p) => Math.max(p.ppm, p.limit ?? 0)));
    return {
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      interaction: { mode: 'index', intersect: false },
      scales: {
        y: {
          beginAtZero: true,
          suggestedMax: Math.ceil((top * 1.1) / 10) * 10,
          title: { display: true, text: 'ppm of green weight' },
          grid: { color: GRID },
        },
        x: { grid: { display: false } },
      },
      plugins: {
        legend: { position: 'bottom', labels: { usePointStyle: true } },
        tooltip: {
          callbacks: {
            title: (items) => {
              const point = points[items[0]?.dataIndex ?? 0];
              return point ? `${point.lot} · ${point.day}` : '';
            },
            label: (item) => `${item.dataset.label ?? ''}: ${Number(item.raw).toFixed(1)}`,
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

function shortDay(iso: string): string {
  const [year, month, day] = iso.split('-').map(Number);
  return SHORT_DAY.format(new Date(year, month - 1, day));
}
