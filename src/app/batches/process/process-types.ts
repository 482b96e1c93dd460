/**
 * The shapes the process record API answers with, declared once in shared/api/process-record.ts
 * (types only) for the server and the console alike.
 */
export type {
  ActualYield,
  BatchControl,
  CorrectiveAction,
  Deviation,
  Disposition,
  NowItem,
  ProcessNow,
  ProcessRecord,
  Reading,
  ReadingAnswer,
  StageName,
  WeighingAnswer,
  Verification,
  Weighing,
} from '../../../../shared/api/process-record.ts';
export type {
  CanonicalUnit,
  ControlLimit,
  ControlState,
  ControlStatus,
  Measure,
  ResolvedControl,
} from '../../../../shared/process/control-types.ts';
