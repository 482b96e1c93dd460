// The blocks of the HACCP records report's PDF: a batch, the refused calculations, the equipment logs.
import type {
  LoggerSummary,
  ReportBatch,
  ReportControl,
  ReportEquipment,
  ReportHead,
  ReportRefusal,
} from '../../shared/api/haccp-report.ts';
import type { Deviation, Reading } from '../../shared/api/process-record.ts';
import { valueWords as inWords } from '../../shared/process/control-words.ts';
import { shortRevision } from './batch-sheet-pdf.ts';
import { INK, SMALL, type Column, type Row, type SheetLayout } from './sheet-layout.ts';
import { heading, subheading } from './sheet-sections.ts';
import { dayInWords, momentInWords } from './sheet-words.ts';

const muted = (text: string) => ({ text, style: { size: SMALL, color: INK.muted } });
export const header = (...labels: string[]): Row => ({ cells: labels.map(muted) });

/** "1 Dec 2026 to 31 Dec 2026" */
export const periodWords = (head: ReportHead): string =>
  `${dayInWords(head.from)} to ${dayInWords(head.to)}`;

/** A value in its control's unit; as kept when the control's unit is not known. */
export function valueWords(value: string, unit: string): string {
  return unit ? inWords(value, unit) : value;
}

/** Who and when: "Tobin Ashgrove, 2 Dec 2026, 14:32". */
export function byWords(by: { displayName: string } | null, at: string): string {
  return `${by?.displayName ?? 'Larderbook'}, ${momentInWords(at)}`;
}

/** A reading's note: where it came from, what it corrects and why, what replaced it. */
function readingNote(reading: Reading): string {
  const notes = [
    reading.source === 'logger' ? 'logger' : `by ${byWords(reading.by, reading.recordedAt)}`,
  ];
  if (reading.enteredAs) notes.push(`entered as ${reading.enteredAs}`);
  if (reading.corrects !== null)
    notes.push(`corrects entry ${reading.corrects}: ${reading.reason ?? ''}`);
  if (reading.correctedBy !== null) notes.push(`replaced by entry ${reading.correctedBy}`);
  return notes.join('; ');
}

/** A logger's readings summed up in a line. */
function loggerWords(logger: LoggerSummary, unit: string): string {
  return (
    `Logger: ${logger.count.toLocaleString('en-GB')} readings from ${momentInWords(logger.first)} to ${momentInWords(logger.last)}, ` +
    `lowest ${valueWords(logger.min, unit)}, highest ${valueWords(logger.max, unit)}; ` +
    `${logger.missed.length ? `${logger.missed.length} missed the limit (listed below)` : 'none missed the limit'}`
  );
}

const CONTROL_COLUMNS: readonly Column[] = [{ width: 3 }, { width: 5 }, { width: 5 }];

/** The controls: each with its limit and source, what was read, and where it stands. */
function controlsTable(layout: SheetLayout, controls: readonly ReportControl[]): void {
  layout.table(
    CONTROL_COLUMNS,
    header('Control', 'Critical limit and source', 'Monitoring'),
    controls.map((control) => ({
      cells: [
        {
          text: control.title,
          style: { weight: 'semibold' },
          sub: { text: control.state, style: { size: SMALL } },
        },
        {
          text: control.limit,
          sub: { text: control.source, style: { size: SMALL, color: INK.muted } },
        },
        [
          control.logger ? loggerWords(control.logger, control.unit) : '',
          `${control.readings.length} entered by hand`,
        ]
          .filter(Boolean)
          .join('. '),
      ],
    })),
  );
  const rows = controls.flatMap((control) =>
    [...(control.logger?.missed ?? []), ...control.readings]
      .sort((a, b) => Date.parse(a.at) - Date.parse(b.at) || a.id - b.id)
      .map((reading) => ({
        cells: [
          momentInWords(reading.at),
          control.title,
          {
            text: valueWords(reading.value, control.unit),
            style: { weight: 'semibold' as const },
          },
          muted(readingNote(reading)),
        ],
        ...(control.logger?.missed.includes(reading) ? { fill: INK.failTint } : {}),
        ...(reading.correctedBy !== null ? { fill: INK.paper } : {}),
      })),
  );
  if (!rows.length) return;
  subheading(layout, 'Readings entered by hand, and logger readings that missed');
  layout.table(
    [{ width: 2.6 }, { width: 3 }, { width: 1.6, align: 'right' }, { width: 5.8 }],
    header('Taken', 'Control', 'Value', 'Recorded'),
    rows,
  );
}

/** The deviations, each with its corrective action's four parts (9 CFR 417.3(a)). */
export function deviationsBlock(layout: SheetLayout, deviations: readonly Deviation[]): void {
  if (!deviations.length) return;
  subheading(layout, 'Deviations and corrective actions');
  layout.table(
    [{ width: 2.6 }, { width: 10.4 }],
    undefined,
    deviations.map((deviation) => {
      const action = deviation.action;
      const lines = action
        ? [
            `Cause: ${action.cause}`,
            `Control restored: ${action.restored}`,
            `Prevention: ${action.prevention}`,
            `Product: ${action.disposition}${action.dispositionGrams ? `, ${action.dispositionGrams} g` : ''}`,
            `Action by ${byWords(action.by, action.recordedAt)}${action.corrects !== null ? `, replacing an earlier action: ${action.reason ?? ''}` : ''}`,
            ...deviation.earlierActions.map(
              (earlier) =>
                `Earlier action by ${byWords(earlier.by, earlier.recordedAt)}: ${earlier.cause}; ${earlier.restored}; ${earlier.prevention}; ${earlier.disposition}`,
            ),
          ]
        : ['OPEN: no corrective action yet; the batch is on hold.'];
      return {
        cells: [
          momentInWords(deviation.openedAt),
          {
            text: deviation.what,
            style: { weight: 'semibold' as const },
            sub: { text: lines.join('\n'), style: { size: SMALL } },
          },
        ],
        ...(action ? {} : { fill: INK.failTint }),
      };
    }),
  );
}

/** One batch: its head, controls, readings, weights, deviations and verification. */
export function batchBlock(layout: SheetLayout, batch: ReportBatch): void {
  heading(layout, `Lot ${batch.lotCode} · ${batch.formula.title}`, 60);
  const people = [
    batch.operator ? `recorded by ${batch.operator.displayName}` : '',
    batch.plannedBy ? `planned by ${batch.plannedBy.displayName}` : '',
    batch.startedBy && batch.startedAt
      ? `started by ${byWords(batch.startedBy, batch.startedAt)}`
      : '',
  ].filter(Boolean);
  layout.paragraph(
    `${batch.formula.id}, revision ${shortRevision(batch.formula.revision)} · starts ${dayInWords(batch.startedOn)} · ${batch.status}${people.length ? ` · ${people.join(' · ')}` : ''}`,
    { size: SMALL, color: INK.muted },
  );
  if (batch.controls.length) controlsTable(layout, batch.controls);
  else layout.paragraph('No process controls in its formula.', { size: SMALL, color: INK.muted });
  if (batch.weighings.length) {
    subheading(layout, 'Weights as weighed');
    layout.table(
      [{ width: 2.6 }, { width: 4 }, { width: 2, align: 'right' }, { width: 4.4 }],
      header('Weighed', 'What', 'Grams', 'Recorded'),
      batch.weighings.map((w) => ({
        cells: [
          momentInWords(w.weighedAt),
          `${w.name}${w.kind === 'stage' ? ' (stage)' : ''}${w.plannedGrams ? `, planned ${w.plannedGrams} g` : ''}`,
          w.grams,
          muted(
            `by ${byWords(w.by, w.recordedAt)}${w.corrects !== null ? `; corrects entry ${w.corrects}: ${w.reason ?? ''}` : ''}${w.correctedBy !== null ? `; replaced by entry ${w.correctedBy}` : ''}`,
          ),
        ],
      })),
    );
  }
  deviationsBlock(layout, batch.deviations);
  const standing = batch.verifications.filter((v) => v.correctedBy === null).at(-1);
  layout.paragraph(
    standing
      ? `Verified and released by ${byWords(standing.by, standing.recordedAt)}${standing.note ? `: ${standing.note}` : ''}`
      : 'Not verified.',
    { weight: 'semibold', size: SMALL, color: standing ? INK.pass : INK.warn },
    { after: 6 },
  );
}

/** The period's refused calculations. */
export function refusalsBlock(layout: SheetLayout, refusals: readonly ReportRefusal[]): void {
  heading(layout, 'Refused calculations');
  if (!refusals.length) return layout.paragraph('None in the period.', { size: SMALL });
  layout.table(
    [{ width: 2.6 }, { width: 3 }, { width: 4 }, { width: 4 }],
    header('When', 'Formula', 'Inputs', 'Refused because'),
    refusals.map((r) => ({
      cells: [
        byWords(r.by, r.at),
        `${r.formula}${r.revision ? `, revision ${shortRevision(r.revision)}` : ''}${r.lotCode ? ` (lot ${r.lotCode})` : ''}`,
        muted(r.inputs),
        r.failed,
      ],
    })),
  );
}

/** The period's equipment logs: readings, thermometer checks, deviations. */
export function equipmentBlock(layout: SheetLayout, equipment: readonly ReportEquipment[]): void {
  heading(layout, 'Equipment logs and thermometer checks');
  if (!equipment.length) return layout.paragraph('None in the period.', { size: SMALL });
  for (const item of equipment) {
    subheading(layout, `${item.name} (${item.kind})`);
    if (item.logger) layout.paragraph(loggerWords(item.logger, '°C'), { size: SMALL });
    const readings = [...(item.logger?.missed ?? []), ...item.readings];
    if (readings.length)
      layout.table(
        [{ width: 2.6 }, { width: 1.6, align: 'right' }, { width: 6 }],
        header('Taken', 'Value', 'Recorded'),
        readings.map((r) => ({
          cells: [momentInWords(r.at), valueWords(r.value, '°C'), muted(readingNote(r))],
        })),
      );
    if (item.calibrations.length)
      layout.table(
        [{ width: 2.6 }, { width: 2 }, { width: 1.6 }, { width: 6 }],
        header('Checked', 'Reading', 'Outcome', 'Recorded'),
        item.calibrations.map((c) => ({
          cells: [
            momentInWords(c.checkedAt),
            c.reading,
            c.outcome,
            muted(
              `by ${byWords(c.by, c.checkedAt)}${c.note ? `; ${c.note}` : ''}${c.corrects !== null ? `; corrects entry ${c.corrects}: ${c.reason ?? ''}` : ''}`,
            ),
          ],
        })),
      );
    deviationsBlock(layout, item.deviations);
  }
}
