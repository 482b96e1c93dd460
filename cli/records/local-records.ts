import type { Batch, BatchPage } from '../../shared/api/batch-record.ts';
import type { ReadingAnswer, ReadingRequest } from '../../shared/api/process-record.ts';
import { existsSync } from 'node:fs';
import type { PlanWithStock } from '../../shared/api/plan-record.ts';
import { presentPlan, readCatalogue, type PresentedPlan } from '../../shared/index.ts';
import { catalogueIn, catalogueText } from '../check-catalogue.ts';
import type { TraceSearch } from '../../shared/api/trace-record.ts';
import type { Receipt, ReceiptRequest, StockView } from '../../shared/api/receipt.ts';
import {
  PROCESS_ROLES,
  RECORDING_ROLES,
  REPORT_ROLES,
  Records,
  TRACE_ROLES,
  RecordsError,
  openRecords,
  recordsFile,
  traceSitesOf,
  type Person,
  type Role,
  type SiteAtWork,
  type SiteScope,
} from '../../server/records/records.ts';
import { CliError, EXIT } from '../cli-error.ts';
import { today } from '../io.ts';
import { credentialsFor } from './credentials.ts';
import type {
  BatchToRecord,
  PlanToRecord,
  RecallOutput,
  RecordKeeper,
  ReportOutput,
  ReportPeriodOptions,
  TracedBothWays,
  UploadedReadings,
} from './record-keeper.ts';
import { cliErrorOf, type PersonVerb, type RecordsVerb } from './records-failure.ts';

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

/** Who a command acts as, the site it works at, and the sites a trace from there may show. */
interface At {
  readonly actor: Person;
  readonly site: SiteScope;
  readonly seen: SiteAtWork['seen'];
}

/**
 * The person recording, from $LARDER_USER and $LARDER_PASSWORD, checked as the server checks a
 * sign-in, at the site the command works at (`--site`, else their default): the command line is
 * held to the same accounts and roles, the role in force being their role at that site.
 */
async function recorder(
  records: Records,
  verb: PersonVerb,
  roles: readonly Role[],
  siteKey: string | undefined,
): Promise<At> {
  const { username, password } = credentialsFor(verb);
  const person = await records.signIn(username, password);
  if (!person)
    throw new CliError(
      'wrong LARDER_USER or LARDER_PASSWORD, or the account is not active',
      EXIT.usage,
    );
  const { site, seen, person: there = person } = await records.siteAtWork(siteKey, person);
  if (!roles.includes(there.role))
    throw new CliError(
      `${there.username} is a ${there.role}${site.filters ? ` at ${site.key}` : ''}; this needs ${roles.join(' or ')}`,
      EXIT.usage,
    );
  return { actor: there, site, seen };
}

/**
 * Opens this machine's records for a verb that acts as a person, signs in $LARDER_USER with a
 * role the verb needs at the site, and runs `work` as them there.
 */
function asPerson<T>(
  verb: PersonVerb,
  roles: readonly Role[],
  siteKey: string | undefined,
  work: (records: Records, by: At) => Promise<T>,
  formulasFolder?: string,
): Promise<T> {
  return withLocalRecords(
    verb,
    async (records) => work(records, await recorder(records, verb, roles, siteKey)),
    formulasFolder,
  );
}

/** The file of this machine's records, which may not exist yet. */
function localRecordsFile(): string {
  try {
    return recordsFile();
  } catch (error) {
    throw error instanceof RecordsError ? cliErrorOf(error, 'list') : error;
  }
}

/**
 * This machine's records. Recording signs in as $LARDER_USER; reading needs no one, as whoever
 * can run larder here can read the database file itself.
 */
export class LocalRecords implements RecordKeeper {
  readonly server = undefined;

  /** @param site the key of the site to work at (`--site`); none: the default, as the API's */
  constructor(private readonly site?: string) {}

  /** Records a batch from the formula file as it is now; its revision joins the formula's history. */
  recordBatch({ folder, ...request }: BatchToRecord): Promise<Batch> {
    return asPerson(
      'record',
      RECORDING_ROLES,
      this.site,
      (records, by) => records.recordBatch(request, today(), by),
      folder,
    );
  }

  /** Makes the plan here, then records its batches as planned, all or nothing. */
  async recordPlan(request: PlanToRecord): Promise<{ plan: PresentedPlan; batches: Batch[] }> {
    // Made before the records are opened: a plan that cannot be made says why first.
    const plan = request.plan();
    return asPerson(
      'record',
      RECORDING_ROLES,
      this.site,
      async (records, by) => ({
        plan: presentPlan(plan, request.units),
        batches: await records.recordPlan(plan, request.units, {
          ...by,
          again: request.again === true,
        }),
      }),
      request.folder,
    );
  }

  /** The plan made here, and its pull list against the lots on hand in this machine's records. */
  async planStock(request: PlanToRecord): Promise<PlanWithStock | undefined> {
    // Printing a plan creates no database: without records there is no stock to speak of.
    if (!existsSync(localRecordsFile())) return undefined;
    const plan = request.plan();
    const catalogueFile = catalogueIn(request.folder);
    const text = catalogueText(catalogueFile);
    const catalogue = text === undefined ? undefined : readCatalogue(text, catalogueFile);
    return withLocalRecords('list', async (records) => ({
      ...presentPlan(plan, request.units),
      stock: await records.planStock(plan, request.formulas(), catalogue, request.units),
    }));
  }

  /** The log of the site (`--site`, else `main`); reading needs no one. */
  listBatches(query: Record<string, string>): Promise<BatchPage> {
    return withLocalRecords('list', async (records) =>
      records.listBatches(query, (await records.siteAtWork(this.site)).site),
    );
  }

  /** A batch of the site; another site's is not found. */
  showBatch(lot: string): Promise<Batch> {
    return withLocalRecords('show', async (records) =>
      records.showBatch(lot, (await records.siteAtWork(this.site)).site),
    );
  }

  addReading(lot: string, request: ReadingRequest): Promise<ReadingAnswer> {
    return asPerson('reading', PROCESS_ROLES, this.site, (records, by) =>
      records.addReading(lot, request, 'command', by),
    );
  }

  uploadReadings(lot: string, control: string, text: string): Promise<UploadedReadings> {
    return asPerson('reading', PROCESS_ROLES, this.site, (records, by) =>
      records.uploadReadings(lot, control, text, by),
    );
  }

  receive(request: ReceiptRequest): Promise<Receipt> {
    return asPerson('receive', RECORDING_ROLES, this.site, (records, by) =>
      records.receive(request, by),
    );
  }

  /** Stock of the site (`--site`, else `main`) on this machine's today (the kitchen's day). */
  stock(): Promise<StockView> {
    return withLocalRecords('stock', async (records) =>
      records.stockOnHand(today(), (await records.siteAtWork(this.site)).site),
    );
  }

  /** The report from this machine's records, as whoever $LARDER_USER is (admin or reviewer). */
  report(format: ReportOutput['format'], period: ReportPeriodOptions): Promise<ReportOutput> {
    return asPerson('report', REPORT_ROLES, this.site, async (records, { actor: by, site }) => {
      const produced = await records.produceReport(format, {
        query: period,
        by,
        // A group's report is one site's records, named for it, as the API's.
        kitchen: site.filters ? site.name : Records.kitchenName(),
        now: new Date(),
        site,
      });
      if (produced.format === 'json') return produced;
      // Read whole before the records close.
      if (produced.format === 'pdf') {
        const chunks: Buffer[] = [];
        for await (const chunk of produced.body) chunks.push(chunk);
        return { format: 'pdf', body: Buffer.concat(chunks) };
      }
      let text = '';
      for await (const chunk of produced.body) text += chunk;
      return { format: 'csv', body: text };
    });
  }

  /**
   * Both ways from a lot of the site (`--site`, else `main`), from this machine's records; reading
   * needs no one, so the lots it reaches at other sites are shown with their site's key.
   */
  trace(lot: string): Promise<TracedBothWays> {
    return withLocalRecords('trace', async (records) => {
      const { site, seen } = await records.siteAtWork(this.site);
      const sites = traceSitesOf(site, seen);
      return {
        back: await records.traceBack(lot, sites),
        forward: await records.traceForward({ lot }, sites),
      };
    });
  }

  /** The recall report from this machine's records, produced as $LARDER_USER (any role). */
  recall(format: RecallOutput['format'], search: TraceSearch): Promise<RecallOutput> {
    return asPerson(
      'recall',
      TRACE_ROLES,
      this.site,
      async (records, { actor: by, site, seen }) => {
        const sites = traceSitesOf(site, seen);
        const produced = await records.produceRecall(format, {
          search,
          by,
          kitchen: Records.kitchenName(),
          now: new Date(),
          ...(sites ? { sites } : {}),
        });
        if (produced.format === 'pdf')
          return { format: 'pdf', body: new Uint8Array(produced.body) };
        return produced;
      },
    );
  }
}
