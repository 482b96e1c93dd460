/** Why a plan was refused, as a stable code the CLI and the API map to an exit code or status. */
export type PlanRefusal =
  /** The count or a date cannot be used. */
  | 'bad-input'
  /** The assembly itself has errors a check reports. */
  | 'invalid-assembly'
  /** A component names a formula that is not in the library (or whose file has errors). */
  | 'missing-formula'
  /** A component's quantity does not fit the kind of the formula it names. */
  | 'wrong-kind'
  /** A cure's hold rule needs a size (thickness, heaviest piece) the component does not give. */
  | 'needs-size'
  /** Assemblies that contain each other. */
  | 'cycle'
  /** A sub-batch would have to start before today. */
  | 'past-start'
  /** A sub-batch's calculator cannot make the batch (too large, a blend target out of reach…). */
  | 'bad-batch'
  /** A sub-batch fails a critical limit: it must not be made, so neither can the plan. */
  | 'critical-limit';

/** The refusals that are a formula file's fault (exit 3 in the CLI). */
export const FORMULA_REFUSALS: readonly PlanRefusal[] = [
  'invalid-assembly',
  'missing-formula',
  'wrong-kind',
  'needs-size',
  'cycle',
];

/** A plan that cannot be made, with the reason in plain words naming the formula at fault. */
export class PlanError extends Error {
  override readonly name = 'PlanError';

  /**
   * @param message what is wrong, naming the formula
   * @param reason the refusal as a stable code
   * @param formula the id of the formula at fault, when one is
   */
  constructor(
    message: string,
    readonly reason: PlanRefusal,
    readonly formula?: string,
  ) {
    super(message);
  }
}
