import type {
  ReportBatch,
  ReportEquipment,
  ReportHead,
  ReportReceipt,
  ReportRefusal,
} from '../../shared/api/haccp-report.ts';
import type { CorrectiveAction, Deviation, Reading } from '../../shared/api/process-record.ts';
import { csvLine } from '../batches/batch-csv.ts';

/** The columns: every entry fills those that apply to its type and leaves the rest empty. */
const COLUMNS = [
  'type',
  'lot_code',
  'formula_id',
  'formula_revision',
  'equipment',
  'control',
  'at',
  'value',
  'unit',
  'entered_as',
  'reading_source',
  'by',
  'recorded_at',
  'entry_id',
  'corrects',
  'corrected_by',
  'reason',
  'limit',
  'limit_source',
  'what',
  'cause',
  'restored',
  'prevention',
  'disposition',
  'disposition_grams',
  'count',
  'first',
  'last',
  'min',
  'max',
  'note',
] as const;

type Column = (typeof COLUMNS)[number];
type Entry = Partial<Record<Column, string | number | null>>;

/** The header record. */
export const HACCP_CSV_HEADER = csvLine(COLUMNS);

/** One entry as a CSV record (RFC 4180, CRLF; formula characters defused). */
function line(entry: Entry): string {
  return csvLine(COLUMNS.map((column) => entry[column] ?? null));
}

/** The head as the first records: whose, which period, who produced it and when. */
export function headCsv(head: ReportHead): string {
  return line({
    type: 'report',
    what: head.kitchen,
    first: head.from,
    last: head.to,
    by: head.producedBy,
    recorded_at: head.producedAt,
    note: `times in ISO 8601 (UTC); the kitchen's time zone is ${head.timeZone}`,
  });
}

function readingEntry(type: string, reading: Reading, unit: string): Entry {
  return {
    type,
    control: reading.control,
    at: reading.at,
    value: reading.value,
    unit,
    entered_as: reading.enteredAs,
    reading_source: reading.source,
    by: reading.by?.displayName ?? null,
    recorded_at: reading.recordedAt,
    entry_id: reading.id,
    corrects: reading.corrects,
    corrected_by: reading.correctedBy,
    reason: reading.reason,
  };
}

function actionEntry(action: CorrectiveAction, deviation: Deviation, type: string): Entry {
  return {
    type,
    control: deviation.control,
    at: action.recordedAt,
    by: action.by?.displayName ?? null,
    recorded_at: action.recordedAt,
    entry_id: action.id,
    corrects: action.corrects,
    corrected_by: action.correctedBy,
    reason: action.reason,
    what: `deviation ${deviation.id}`,
    cause: action.cause,
    restored: action.restored,
    prevention: action.prevention,
    disposition: action.disposition,
    disposition_grams: action.dispositionGrams,
  };
}

/** A deviation and its corrective actions, earlier ones first. */
function deviationEntries(deviation: Deviation): Entry[] {
  return [
    {
      type: 'deviation',
      control: deviation.control,
      at: deviation.openedAt,
      by: deviation.openedBy?.displayName ?? null,
      entry_id: deviation.id,
      what: deviation.what,
      note: deviation.action ? `${deviation.kind}; closed` : `${deviation.kind}; open: on hold`,
    },
    ...deviation.earlierActions.map((a) => actionEntry(a, deviation, 'corrective-action')),
    ...(deviation.action ? [actionEntry(deviation.action, deviation, 'corrective-action')] : []),
  ];
}

/** Every entry of one batch as CSV records, each carrying the lot code. */
export function batchCsv(batch: ReportBatch): string {
  const lot = {
    lot_code: batch.lotCode,
    formula_id: batch.formula.id,
    formula_revision: batch.formula.revision,
  };
  const entries: Entry[] = [
    {
      type: 'batch',
      at: batch.startedAt ?? batch.startedOn,
      what: batch.formula.title,
      by: batch.operator?.displayName ?? null,
      note: [
        batch.status,
        batch.plannedBy ? `planned by ${batch.plannedBy.displayName}` : '',
        batch.startedBy ? `started by ${batch.startedBy.displayName}` : '',
      ]
        .filter(Boolean)
        .join('; '),
    },
  ];
  for (const control of batch.controls) {
    entries.push({
      type: 'control',
      control: control.id,
      what: control.title,
      unit: control.unit,
      limit: control.limit,
      limit_source: control.source,
      note: control.state,
    });
    if (control.logger)
      entries.push({
        type: 'logger-summary',
        control: control.id,
        unit: control.unit,
        count: control.logger.count,
        first: control.logger.first,
        last: control.logger.last,
        min: control.logger.min,
        max: control.logger.max,
        note: `${control.logger.missed.length} missed the limit`,
      });
    for (const reading of control.logger?.missed ?? [])
      entries.push(readingEntry('logger-reading-missed', reading, control.unit));
    for (const reading of control.readings)
      entries.push(readingEntry('reading', reading, control.unit));
  }
  for (const w of batch.weighings)
    entries.push({
      type: 'weighing',
      at: w.weighedAt,
      what: `${w.kind}: ${w.name}`,
      value: w.grams,
      unit: 'g',
      by: w.by?.displayName ?? null,
      recorded_at: w.recordedAt,
      entry_id: w.id,
      corrects: w.corrects,
      corrected_by: w.correctedBy,
      reason: w.reason,
      note: w.plannedGrams ? `planned ${w.plannedGrams} g` : null,
    });
  for (const deviation of batch.deviations) entries.push(...deviationEntries(deviation));
  for (const v of batch.verifications)
    entries.push({
      type: 'verification',
      at: v.recordedAt,
      by: v.by?.displayName ?? null,
      recorded_at: v.recordedAt,
      entry_id: v.id,
      corrects: v.corrects,
      corrected_by: v.correctedBy,
      reason: v.reason,
      note: v.note,
    });
  return entries.map((entry) => line({ ...lot, ...entry })).join('');
}

/** The refused calculations as CSV records. */
export function refusalsCsv(refusals: readonly ReportRefusal[]): string {
  return refusals
    .map((r) =>
      line({
        type: 'refusal',
        lot_code: r.lotCode,
        formula_id: r.formula,
        formula_revision: r.revision,
        at: r.at,
        by: r.by?.displayName ?? null,
        what: r.failed,
        note: r.inputs,
      }),
    )
    .join('');
}

/** The equipment logs as CSV records. */
export function equipmentCsv(equipment: readonly ReportEquipment[]): string {
  return equipment
    .flatMap((item) => {
      const entries: Entry[] = [];
      if (item.logger)
        entries.push({
          type: 'equipment-logger-summary',
          unit: '°C',
          count: item.logger.count,
          first: item.logger.first,
          last: item.logger.last,
          min: item.logger.min,
          max: item.logger.max,
        });
      for (const r of [...(item.logger?.missed ?? []), ...item.readings])
        entries.push(readingEntry('equipment-reading', r, '°C'));
      for (const c of item.calibrations)
        entries.push({
          type: 'calibration',
          at: c.checkedAt,
          value: c.reading,
          by: c.by?.displayName ?? null,
          entry_id: c.id,
          corrects: c.corrects,
          reason: c.reason,
          what: c.outcome,
          note: c.note,
        });
      for (const d of item.deviations) entries.push(...deviationEntries(d));
      return entries.map((entry) => line({ equipment: item.name, ...entry }));
    })
    .join('');
}

/** The deliveries at the door as CSV records: the receiving control, each with its deviation. */
export function receivingCsv(receiving: readonly ReportReceipt[]): string {
  return receiving
    .map((r) =>
      [
        {
          type: 'receipt',
          lot_code: r.lotCode,
          control: 'receiving',
          at: r.receivedAt,
          value: r.temperatureC,
          unit: r.temperatureC === null ? null : '°C',
          by: r.by?.displayName ?? null,
          limit: r.limit,
          limit_source: r.limitSource,
          what: `${r.itemName} from ${r.supplier}, lot ${r.supplierLot}${r.establishment ? `, ${r.establishment}` : ''}: ${r.found}`,
          note: r.note ? `${r.decision}; ${r.note}` : r.decision,
        },
        ...r.deviations.flatMap(deviationEntries),
      ]
        .map((entry) => line({ lot_code: r.lotCode, ...entry }))
        .join(''),
    )
    .join('');
}
