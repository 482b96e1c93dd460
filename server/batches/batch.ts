import type { RecordStatus } from '../../shared/workflow/batch-status.ts';
import type { Role } from '../../shared/api/person.ts';
import type { SiteScope } from '../sites/site-scope.ts';
import type { FormulaSite } from '../formulas/formula-site.ts';
import type {
  FormulaKind,
  PresentedResult,
  RawBatchOptions,
  UnitSystem,
} from '../../shared/index.ts';

/** What is stored for a new batch; the lot code and times are added when it is written. */
export interface NewBatch {
  readonly formula: { readonly id: string; readonly revision: string; readonly title: string };
  readonly kind: FormulaKind;
  readonly status: RecordStatus;
  readonly operatorId: number;
  readonly startedOn: string;
  readonly readyOn: string | null;
  readonly units: UnitSystem;
  readonly inputs: RawBatchOptions;
  readonly result: PresentedResult;
  readonly checksPassed: boolean;
  readonly nitritePpm: string | null;
  readonly notes: string | null;
}

/** Who makes a change, for the batch event and the audit log; the role for the workflow rules. */
export interface BatchActor {
  readonly id: number;
  readonly username: string;
  readonly role: Role;
}

/** How a change is written: by whom, from where, and (for demo history only) when. */
export interface ChangeOptions {
  readonly actor: BatchActor;
  readonly ip?: string;
  /** ISO timestamp of the change: the server's clock, or the demo's history; now when not given. */
  readonly at?: string;
  /** Whether to append to the audit log; only the demo seed, writing history, turns it off. */
  readonly audit?: boolean;
  /**
   * The site the change is made at: a new row belongs to it, and a row named by lot code or id
   * must be its. None: the first site (a single-site install, the demo's seed).
   */
  readonly site?: SiteScope;
  /** The formulas that site sees (filesAtSite); none: every formula. */
  readonly formulas?: FormulaSite;
}
