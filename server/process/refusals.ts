import { QueryTypes } from 'sequelize';
import { andSite, siteIdOf, type SiteScope } from '../sites/site-scope.ts';
import type { RawBatchOptions } from '../../shared/index.ts';
import type { Refusal } from '../../shared/api/process-record.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import type { Database } from '../db/database.ts';
import { insertRow } from '../db/insert-row.ts';
import { badRequest } from '../http/app-error.ts';
import { RecordsError } from '../records/records-error.ts';

/** A calculation refused over a critical limit: who tried what, from which formula. */
export interface RefusedCalculation {
  readonly formula: string;
  readonly revision: string | null;
  readonly inputs: RawBatchOptions;
  /** The planned batch a refused start was for. */
  readonly lotCode?: string;
}

/** The failed checks of a 'critical-limit' refusal in words, as prepareBatch gives them. */
function failedSentences(error: RecordsError): string[] {
  return error.details.map((detail) =>
    String((detail as { sentence?: unknown }).sentence ?? JSON.stringify(detail)),
  );
}

/**
 * Runs a calculation that may be refused over a critical limit; when it is, writes the refusal
 * (a refusals row and a 'calculation-refused' audit entry, in a write of its own, so the record
 * of the refusal stands though nothing else is written) and throws the refusal on.
 */
export async function keepingRefusals<T>(
  deps: { db: Database; audit: AuditRepository },
  tried: RefusedCalculation,
  by: ChangeOptions,
  work: () => T | Promise<T>,
): Promise<T> {
  try {
    return await work();
  } catch (error) {
    if (error instanceof RecordsError && error.code === 'critical-limit')
      await writeRefusal(deps, tried, failedSentences(error), by);
    throw error;
  }
}

async function writeRefusal(
  { db, audit }: { db: Database; audit: AuditRepository },
  tried: RefusedCalculation,
  failed: readonly string[],
  by: ChangeOptions,
): Promise<void> {
  const at = by.at ?? new Date().toISOString();
  await db.write(async (t) => {
    const { lastId: id } = await insertRow(
      db,
      t,
      `INSERT INTO refusals (at, person_id, formula_id, formula_revision, inputs, failed, lot_code,
         site_id)
       VALUES (?, ?, ?, ?, ?, ?, ?, ?)`,
      [
        at,
        by.actor.id,
        tried.formula,
        tried.revision,
        JSON.stringify(tried.inputs),
        JSON.stringify(failed),
        tried.lotCode ?? null,
        siteIdOf(by.site),
      ],
    );
    await audit.append(
      {
        actor: by.actor,
        action: 'calculation-refused',
        subject: tried.lotCode ?? tried.formula,
        detail: {
          refusal: id,
          formula: tried.formula,
          revision: tried.revision,
          inputs: tried.inputs,
          failed,
        },
        ...(by.ip === undefined ? {} : { ip: by.ip }),
      },
      t,
    );
  });
}

interface RefusalRow {
  id: number;
  at: string;
  person_id: number | null;
  display_name: string | null;
  formula_id: string;
  formula_revision: string | null;
  inputs: string;
  failed: string;
  lot_code: string | null;
}

const DAY = /^\d{4}-\d{2}-\d{2}$/;

/** The day after an ISO day, for an inclusive `to`. */
function dayAfter(day: string): string {
  return new Date(Date.parse(`${day}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10);
}

/**
 * The refusals from one day to another, both included (UTC days, YYYY-MM-DD; either may be left
 * out), newest first, at most 1000.
 * @throws AppError 400 for a day that is not YYYY-MM-DD
 */
export async function listRefusals(
  db: Database,
  range: { from?: string; to?: string },
  site?: SiteScope,
): Promise<Refusal[]> {
  const atSite = andSite(site, 'r.site_id');
  for (const [name, day] of Object.entries(range))
    if (day !== undefined && (!DAY.test(day) || Number.isNaN(Date.parse(day))))
      throw badRequest(`${name} must be a day as YYYY-MM-DD`, [
        { field: name, message: 'is not a day' },
      ]);
  const rows = await db.sequelize.query<RefusalRow>(
    `SELECT r.id, r.at, r.person_id, p.display_name, r.formula_id, r.formula_revision, r.inputs,
       r.failed, r.lot_code
     FROM refusals r LEFT JOIN people p ON p.id = r.person_id
     WHERE r.at >= ? AND r.at < ?${atSite.sql} ORDER BY r.at DESC, r.id DESC LIMIT 1000`,
    {
      replacements: [
        range.from ?? '0000',
        range.to ? dayAfter(range.to) : '9999',
        ...atSite.values,
      ],
      type: QueryTypes.SELECT,
    },
  );
  return rows.map((row) => ({
    id: row.id,
    at: row.at,
    by:
      row.person_id === null
        ? null
        : { id: row.person_id, displayName: row.display_name ?? `person ${row.person_id}` },
    formula: row.formula_id,
    revision: row.formula_revision,
    inputs: JSON.parse(row.inputs) as RawBatchOptions,
    failed: JSON.parse(row.failed) as string[],
    lotCode: row.lot_code,
  }));
}
