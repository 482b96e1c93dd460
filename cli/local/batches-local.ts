import path from 'node:path';
import type { RawBatchOptions, UnitSystem } from '../../shared/index.ts';
import { AuditRepository } from '../../server/audit/audit-repository.ts';
import type { Batch, BatchPage } from '../../shared/api/batch-record.ts';
import { parseListQuery } from '../../server/batches/batch-query.ts';
import { BatchRepository } from '../../server/batches/batch-repository.ts';
import { prepareBatch } from '../../server/batches/prepare-batch.ts';
import { FormulaHistory } from '../../server/formulas/formula-history.ts';
import { FormulaStore } from '../../server/formulas/formula-store.ts';
import { AppError } from '../../server/http/app-error.ts';
import { CliError, EXIT } from '../cli-error.ts';
import { operatorFromEnvironment } from './batch-operator.ts';
import { withLocalDatabase } from './local-database.ts';

/** What `larder calc --record` records. */
export interface LocalRecord {
  readonly formulaFile: string;
  readonly formulaId: string;
  readonly batch: RawBatchOptions;
  readonly units: UnitSystem;
  readonly status?: 'planned' | 'in-progress';
  readonly notes?: string;
}

/** The server's errors as the command's: a refused batch exits 4, bad input 2. */
export function asCliError(error: unknown): unknown {
  if (!(error instanceof AppError)) return error;
  const details = error.details.map((d) =>
    typeof d === 'object' && d && 'sentence' in d ? String(d.sentence) : JSON.stringify(d),
  );
  const code =
    error.code === 'critical-limit'
      ? EXIT.critical
      : error.status === 404 || error.code === 'invalid-formula'
        ? EXIT.formula
        : EXIT.usage;
  return new CliError(error.message, code, error.code === 'critical-limit' ? [] : details);
}

/**
 * Records a batch in this machine's database, calculated from the formula file as it is now
 * (its revision joins the formula's history), exactly as the server records one.
 */
export function recordLocally(request: LocalRecord, today: string): Promise<Batch> {
  return withLocalDatabase(async (db, config) => {
    const operator = await operatorFromEnvironment(db, ['admin', 'cook']);
    const audit = new AuditRepository(db);
    const history = new FormulaHistory(
      new FormulaStore(path.dirname(path.resolve(request.formulaFile))),
      db,
      audit,
    );
    try {
      const current = await history.current(request.formulaId);
      const prepared = prepareBatch(
        current,
        {
          formula: request.formulaId,
          batch: request.batch,
          units: request.units,
          status: request.status,
          notes: request.notes,
        },
        operator.id,
        today,
      );
      return await new BatchRepository(db, audit, config.workflow).record(prepared, {
        actor: operator,
      });
    } catch (error) {
      throw asCliError(error);
    }
  });
}

/** A page of this machine's batch log, filtered as the API filters (formula, status, from, to…). */
export function listLocally(query: Record<string, string>): Promise<BatchPage> {
  return withLocalDatabase(async (db, config) => {
    await operatorFromEnvironment(db, ['admin', 'cook', 'reviewer']);
    try {
      return await new BatchRepository(db, new AuditRepository(db), config.workflow).list(
        parseListQuery(query, true),
      );
    } catch (error) {
      throw asCliError(error);
    }
  });
}

/** One batch of this machine's log with its events. */
export function showLocally(lot: string): Promise<Batch> {
  return withLocalDatabase(async (db, config) => {
    await operatorFromEnvironment(db, ['admin', 'cook', 'reviewer']);
    const batch = await new BatchRepository(db, new AuditRepository(db), config.workflow).get(
      lot.toUpperCase(),
    );
    if (!batch) throw new CliError(`no batch with lot code ${lot}`, EXIT.usage);
    return batch;
  });
}
