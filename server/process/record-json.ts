/**
 * A process record written as JSON with each control's readings spliced in as SQLite wrote them:
 * a day of logger points is thousands of readings, and parsing them, building them as objects
 * and stringifying them again was most of the record's time.
 */
import type { BatchControl, ProcessRecord } from '../../shared/api/process-record.ts';
import type { ControlReadings } from './record-readings.ts';

/** A process record but its lot code and controls. */
export type RecordRest = Omit<ProcessRecord, 'lotCode' | 'controls'>;

const NO_READINGS = Buffer.from('[]');

/**
 * The UTF-8 bytes of what `JSON.stringify` gives of the record `{ lotCode, controls, ...rest }`,
 * each control `{ control, state, readings }`, its readings the JSON in `readings` (none when
 * absent), in pieces to be sent one after another: joining them would allocate the megabyte of
 * a day's logger points once more, and V8 counts such buffers towards its next full collection.
 */
export function recordJson(
  lotCode: string,
  controls: readonly Omit<BatchControl, 'readings'>[],
  readings: ReadonlyMap<string, ControlReadings>,
  rest: RecordRest,
): Buffer[] {
  const parts: Buffer[] = [];
  let text = `{"lotCode":${JSON.stringify(lotCode)},"controls":[`;
  controls.forEach(({ control, state }, index) => {
    text += `${index === 0 ? '' : ','}{"control":${JSON.stringify(control)},"state":${JSON.stringify(state)},"readings":`;
    parts.push(Buffer.from(text), readings.get(control.id)?.json ?? NO_READINGS);
    text = '}';
  });
  // rest is an object with keys, so its text is "{…}": its keys follow the controls'.
  parts.push(Buffer.from(`${text}],${JSON.stringify(rest).slice(1)}`));
  return parts;
}
