import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import {
  Decimation,
  Filler,
  Legend,
  type ChartData,
  type ChartDataset,
  type ChartOptions,
} from 'chart.js';
import { ChartFrame } from '../../../ui/chart-frame/chart-frame';
import { CHART_GRID, CHART_LIMIT_INK } from '../../../ui/chart-frame/chart-inks';
import { provideLineChart } from '../../../ui/chart-frame/line-chart-parts';
import { curvePoints, limitBands, type CurvePoint, type LimitBand } from '../curve-points';
import type { BatchControl } from '../process-types';
import { clockWords, limitWords, valueWords } from '../process-words';
import { clockTicks } from './clock-ticks';

// Tones of our palette (_theme-colors.scss), as chart-inks.ts: readings in brown, a range in olive.
const INK = '#974824';
const RANGE_INK = '#566433';
const RANGE_FILL = 'rgba(86, 100, 51, 0.14)';

/** Above this many readings the curve is thinned for drawing (the table keeps every reading). */
const DECIMATE_ABOVE = 400;

/**
 * The curve of one temperature control: every standing reading against a time axis to scale,
 * with the critical limit drawn apart from the data (dashed, no points): a range shaded between
 * its edges, a maximum or minimum as a line, each cooling stage as its target up to its deadline.
 * Made for a day of logger readings: no animation, parsing off, and thinned past 400 points.
 */
@Component({
  selector: 'app-control-chart',
  imports: [ChartFrame],
  providers: [provideLineChart(Legend, Filler, Decimation)],
  template: `
    <app-chart-frame
      [data]="data()"
      [options]="options()"
      [summary]="summary()"
      [height]="260"
      [small]="true"
      testId="control-chart"
      >{{ summary() }}</app-chart-frame
    >
  `,
  styles: `
    app-chart-frame {
      margin-top: 12px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ControlChart {
  /** The control, its state and readings. */
  readonly control = input.required<BatchControl>();

  private readonly points = computed(() => curvePoints(this.control().readings));
  private readonly span = computed(() => {
    const points = this.points();
    const from = points[0]?.x ?? Date.now();
    const last = points.at(-1)?.x ?? from;
    const due = this.control().state.stage?.deadline;
    const to = Math.max(last, due ? new Date(due).getTime() : last, from + 30 * 60_000);
    return { from, to };
  });
  private readonly bands = computed(() =>
    limitBands(this.control().control.limit, this.points(), this.span(), {
      temp: (c) => valueWords(c, '°C'),
      clock: (ms) => clockWords(new Date(ms).toISOString()),
    }),
  );

  protected readonly summary = computed(() => {
    const { control, readings } = this.control();
    const points = this.points();
    const last = points.at(-1);
    const lastWords = last
      ? ` The last, ${valueWords(String(last.y), '°C')} at ${clockWords(new Date(last.x).toISOString())}.`
      : '';
    return (
      `${control.title}: ${points.length} ${points.length === 1 ? 'reading' : 'readings'} ` +
      `against the limit, ${limitWords(control.limit, control.unit)}.${lastWords}` +
      (readings.length > points.length ? ' Corrected readings are drawn at their new value.' : '')
    );
  });

  protected readonly data = computed<ChartData<'line', CurvePoint[]>>(() => {
    const points = this.points();
    return {
      datasets: [
        {
          label: 'Readings (°C)',
          data: points,
          borderColor: INK,
          backgroundColor: INK,
          borderWidth: 2,
          pointRadius: points.length > 60 ? 0 : 3,
          // A reading on the axis's first or last moment is drawn whole, not cut in half.
          clip: 6,
          pointHoverRadius: 5,
          tension: 0,
          order: 0,
        },
        ...this.bands().flatMap(bandDatasets),
      ],
    };
  });

  protected readonly options = computed<ChartOptions<'line'>>(() => {
    const { from, to } = this.span();
    return {
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      parsing: false,
      normalized: true,
      spanGaps: true,
      interaction: { mode: 'nearest', axis: 'x', intersect: false },
      scales: {
        x: {
          type: 'linear',
          min: from,
          max: to,
          grid: { color: CHART_GRID },
          // Round clock times; the browser's zone is the kitchen's (clockWords says them there).
          afterBuildTicks: (axis) => {
            const offset = -new Date(from).getTimezoneOffset() * 60_000;
            axis.ticks = clockTicks(from, to, offset).map((value) => ({ value }));
          },
          ticks: {
            callback: (value) => clockWords(new Date(Number(value)).toISOString()),
          },
        },
        y: { title: { display: true, text: '°C' }, grid: { color: CHART_GRID } },
      },
      plugins: {
        decimation: {
          enabled: true,
          algorithm: 'lttb',
          samples: DECIMATE_ABOVE,
          threshold: DECIMATE_ABOVE,
        },
        legend: {
          position: 'bottom',
          labels: { usePointStyle: true, boxHeight: 8, filter: (item) => !!item.text },
        },
        tooltip: {
          callbacks: {
            title: (items) => clockWords(new Date(items[0]?.parsed.x ?? 0).toISOString()),
            label: (item) =>
              `${item.dataset.label ?? ''}: ${valueWords(String(item.parsed.y), '°C')}`,
          },
        },
      },
    };
  });
}

/** A band as chart lines: dashed, without points, apart from the readings. */
function bandDatasets(band: LimitBand): ChartDataset<'line', CurvePoint[]>[] {
  const dashed = {
    borderWidth: 2,
    borderDash: [6, 4],
    pointRadius: 0,
    pointHoverRadius: 0,
    pointStyle: 'line' as const,
    tension: 0,
    order: 1,
  };
  if (band.kind === 'range')
    return [
      {
        ...dashed,
        label: band.label,
        data: [...band.points],
        borderColor: RANGE_INK,
        backgroundColor: RANGE_FILL,
        fill: '+1',
      },
      {
        ...dashed,
        label: '',
        data: [...(band.other ?? [])],
        borderColor: RANGE_INK,
        backgroundColor: RANGE_FILL,
      },
    ];
  return [
    {
      ...dashed,
      label: band.label,
      data: [...band.points],
      borderColor: CHART_LIMIT_INK,
      backgroundColor: CHART_LIMIT_INK,
    },
  ];
}
