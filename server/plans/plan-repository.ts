import { QueryTypes, type Transaction } from 'sequelize';
import { andSite, siteCondition, siteIdOf, type SiteScope } from '../sites/site-scope.ts';
import type { PlanResult } from '../../shared/index.ts';
import type { BatchSummary } from '../../shared/api/batch-record.ts';
import type { PlanListItem } from '../../shared/api/plan-record.ts';
import { appendChange } from '../audit/append-change.ts';
import type { AuditRepository } from '../audit/audit-repository.ts';
import {
  BATCHES_WITH_PEOPLE,
  SUMMARY_COLUMNS,
  toSummary,
  type BatchRow,
} from '../batches/batch-rows.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import type { Database } from '../db/database.ts';
import { insertRow } from '../db/insert-row.ts';
import { readRows } from '../db/read-row.ts';

/** The most plans GET /api/plans lists. */
export const PLANS_LISTED = 100;

interface PlanRow {
  assembly_id: string;
  assembly_title: string;
  count: number;
  service_date: string;
  made_by: number | null;
  made_by_name: string | null;
  made_at: string;
  recorded_by: number | null;
  recorded_by_name: string | null;
  recorded_at: string | null;
  recorded_batches: number;
}

/**
 * The beginning of the note every batch of a plan for this menu item and day carries, whatever
 * the count ("plan: smokehouse-burger ×120 for 2026-12-18"; see planNote), as a LIKE pattern.
 * Formula ids hold only a-z, 0-9 and "-", so nothing in them is a LIKE wildcard.
 */
export function planNotePattern(assembly: string, serviceDate: string): string {
  return `plan: ${assembly} ×% for ${serviceDate}`;
}

function person(id: number | null, name: string | null): PlanListItem['madeBy'] {
  return id === null ? null : { id, displayName: name ?? '' };
}

/** A row as the API lists it. */
function toItem(row: PlanRow): PlanListItem {
  return {
    assembly: { id: row.assembly_id, title: row.assembly_title },
    count: row.count,
    serviceDate: row.service_date,
    madeBy: person(row.made_by, row.made_by_name),
    madeAt: row.made_at,
    recorded:
      row.recorded_at === null
        ? null
        : {
            by: person(row.recorded_by, row.recorded_by_name),
            at: row.recorded_at,
            batches: row.recorded_batches,
          },
  };
}

/**
 * Plans as they are made and recorded: one row per menu item, count and day of service. Making a
 * plan that was made before changes nothing; recording one notes who, when and how many batches.
 * Every change appends to the audit log.
 */
export class PlanRepository {
  constructor(
    private readonly db: Database,
    private readonly audit: AuditRepository,
  ) {}

  /** Notes a plan as made, once: the first person to work it out, and when. */
  made(plan: PlanResult, options: ChangeOptions): Promise<void> {
    return this.db.write(async (t) => {
      const { changes } = await insertRow(
        this.db,
        t,
        `INSERT INTO plans (assembly_id, assembly_title, count, service_date, made_by, made_at,
           site_id)
         VALUES (?, ?, ?, ?, ?, ?, ?) ON CONFLICT DO NOTHING`,
        [
          ...this.key(plan),
          options.actor.id,
          options.at ?? new Date().toISOString(),
          siteIdOf(options.site),
        ],
      );
      if (changes > 0) await this.audited(t, options, 'plan-make', plan, {});
    });
  }

  /** Notes, inside the caller's write, that the plan's batches were recorded (again or not). */
  async recorded(
    t: Transaction,
    plan: PlanResult,
    lots: readonly string[],
    again: boolean,
    options: ChangeOptions,
  ): Promise<void> {
    const at = options.at ?? new Date().toISOString();
    await insertRow(
      this.db,
      t,
      `INSERT INTO plans (assembly_id, assembly_title, count, service_date, made_by, made_at,
         recorded_by, recorded_at, recorded_batches, site_id) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)
       ON CONFLICT (site_id, assembly_id, count, service_date) DO UPDATE SET
         recorded_by = excluded.recorded_by, recorded_at = excluded.recorded_at,
         recorded_batches = plans.recorded_batches + excluded.recorded_batches`,
      [
        ...this.key(plan),
        options.actor.id,
        at,
        options.actor.id,
        at,
        lots.length,
        siteIdOf(options.site),
      ],
    );
    await this.audited(t, options, 'plan-record', plan, { lots, again });
  }

  /**
   * The batches, not discarded, already recorded from a plan for this menu item and day of
   * service (any count) at the site, earliest start first; inside a write when given one.
   */
  async batchesOf(
    assembly: string,
    serviceDate: string,
    t?: Transaction,
    site?: SiteScope,
  ): Promise<BatchSummary[]> {
    const atSite = andSite(site, 'b.site_id');
    const sql = `SELECT ${SUMMARY_COLUMNS} FROM ${BATCHES_WITH_PEOPLE}
      WHERE b.notes LIKE ? AND b.status <> 'discarded'${atSite.sql} ORDER BY b.started_on, b.id`;
    const values = [planNotePattern(assembly, serviceDate), ...atSite.values];
    const rows = t
      ? await this.db.sequelize.query<BatchRow>(sql, {
          replacements: values,
          type: QueryTypes.SELECT,
          transaction: t,
        })
      : await readRows<BatchRow>(this.db.sequelize, sql, values);
    return rows.map(toSummary);
  }

  /** The latest plans made at the site (no site: anywhere), newest first. */
  async list(site?: SiteScope): Promise<PlanListItem[]> {
    const where = siteCondition(site, 'p.site_id');
    const rows = await readRows<PlanRow>(
      this.db.sequelize,
      `SELECT p.assembly_id, p.assembly_title, p.count, p.service_date, p.made_by,
         mb.display_name AS made_by_name, p.made_at, p.recorded_by,
         rb.display_name AS recorded_by_name, p.recorded_at, p.recorded_batches
       FROM plans p LEFT JOIN people mb ON mb.id = p.made_by LEFT JOIN people rb ON rb.id = p.recorded_by
       ${where.sql ? `WHERE ${where.sql}` : ''}
       ORDER BY p.made_at DESC, p.id DESC LIMIT ?`,
      [...where.values, PLANS_LISTED],
    );
    return rows.map(toItem);
  }

  private key(plan: PlanResult): [string, string, number, string] {
    return [plan.assembly.id, plan.assembly.title, plan.count, plan.serviceDate];
  }

  private audited(
    t: Transaction,
    options: ChangeOptions,
    action: 'plan-make' | 'plan-record',
    plan: PlanResult,
    detail: object,
  ): Promise<void> {
    return appendChange(this.audit, t, options, action, plan.assembly.id, {
      count: plan.count,
      serviceDate: plan.serviceDate,
      ...detail,
    });
  }
}
