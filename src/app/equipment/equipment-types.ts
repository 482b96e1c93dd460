/** The equipment API's shapes, declared once in shared/api/equipment.ts (types only). */
export type {
  Calibration,
  CalibrationAnswer,
  CalibrationOutcome,
  CalibrationRequest,
  Equipment,
  EquipmentAddRequest,
  EquipmentChangeRequest,
  EquipmentControl,
  EquipmentDeviation,
  EquipmentKind,
  EquipmentList,
  EquipmentLog,
  EquipmentReading,
  EquipmentReadingAnswer,
  EquipmentReadingRequest,
} from '../../../shared/api/equipment.ts';
