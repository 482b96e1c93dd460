import type { Batch, BatchPage } from '../../shared/api/batch-record.ts';
import { presentPlan, type PresentedPlan } from '../../shared/index.ts';
import {
  RECORDING_ROLES,
  RecordsError,
  openRecords,
  type Person,
  type Records,
} from '../../server/records/records.ts';
import { CliError, EXIT } from '../cli-error.ts';
import { today } from '../io.ts';
import { credentialsFor } from './credentials.ts';
import type { BatchToRecord, PlanToRecord, RecordKeeper } from './record-keeper.ts';
import { cliErrorOf, type RecordsVerb } from './records-failure.ts';

/**
 * Opens this machine's records (the database the server uses, found through the same settings),
 * runs `work` and closes them; their failures become the verb's.
 * @param formulasFolder where the formulas of batches being recorded are read
 */
export async function withLocalRecords<T>(
  verb: RecordsVerb,
  work: (records: Records) => Promise<T>,
  formulasFolder?: string,
): Promise<T> {
  try {
    const records = await openRecords(formulasFolder);
    try {
      return await work(records);
    } finally {
      await records.close();
    }
  } catch (error) {
    throw error instanceof RecordsError ? cliErrorOf(error, verb) : error;
  }
}

/**
 * The person recording, from $LARDER_USER and $LARDER_PASSWORD, checked as the server checks a
 * sign-in: the command line is held to the same accounts and roles.
 */
async function recorder(records: Records): Promise<Person> {
  const { username, password } = credentialsFor('record');
  const person = await records.signIn(username, password);
  if (!person)
    throw new CliError(
      'wrong LARDER_USER or LARDER_PASSWORD, or the account is not active',
      EXIT.usage,
    );
  if (!RECORDING_ROLES.includes(person.role))
    throw new CliError(
      `${person.username} is a ${person.role}; this needs ${RECORDING_ROLES.join(' or ')}`,
      EXIT.usage,
    );
  return person;
}

/**
 * This machine's records. Recording signs in as $LARDER_USER; reading needs no one, as whoever
 * can run larder here can read the database file itself.
 */
export class LocalRecords implements RecordKeeper {
  readonly server = undefined;

  /** Records a batch from the formula file as it is now; its revision joins the formula's history. */
  recordBatch({ folder, ...request }: BatchToRecord): Promise<Batch> {
    return withLocalRecords(
      'record',
      async (records) => records.recordBatch(request, today(), { actor: await recorder(records) }),
      folder,
    );
  }

  /** Makes the plan here, then records its batches as planned, all or nothing. */
  async recordPlan(request: PlanToRecord): Promise<{ plan: PresentedPlan; batches: Batch[] }> {
    // Made before the records are opened: a plan that cannot be made says why first.
    const plan = request.plan();
    return withLocalRecords(
      'record',
      async (records) => ({
        plan: presentPlan(plan, request.units),
        batches: await records.recordPlan(plan, request.units, {
          actor: await recorder(records),
        }),
      }),
      request.folder,
    );
  }

  listBatches(query: Record<string, string>): Promise<BatchPage> {
    return withLocalRecords('list', (records) => records.listBatches(query));
  }

  showBatch(lot: string): Promise<Batch> {
    return withLocalRecords('show', (records) => records.showBatch(lot));
  }
}
