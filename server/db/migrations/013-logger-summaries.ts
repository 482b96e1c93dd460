import type { QueryInterface } from 'sequelize';
import { onPostgres, runStatements } from './run-statements.ts';

/**
 * A data logger's readings of a batch summed up per control as they are written: how many stand,
 * the first and last time, the lowest and highest value. A month of a busy kitchen is a million
 * logger readings; the HACCP report reads these thousand rows instead of grouping them all again.
 * SQLite's triggers keep the table, so every way a reading is written (the API, a logger file, the
 * command, a script writing into the table) keeps it true. A logger reading stands until a
 * correction names it; the lowest and highest are compared as numbers (the stored text is kept),
 * the earlier entry first among equal values. Also an index of the readings a person entered, for
 * the report to find the few among a batch's thousands of logger readings.
 */
export const name = '013-logger-summaries';

/** A logger reading of a batch that stands: no correction names it. */
const STANDING = `x.source = 'logger' AND x.batch_id IS NOT NULL
  AND NOT EXISTS (SELECT 1 FROM readings c WHERE c.corrects_id = x.id)`;

/** The lowest (ASC) or highest (DESC) standing value of x's batch and control, earlier entry first. */
const extreme = (order: 'ASC' | 'DESC', real = 'REAL') =>
  `(SELECT m.value FROM readings m WHERE m.batch_id = x.batch_id AND m.control = x.control
     AND m.source = 'logger' AND NOT EXISTS (SELECT 1 FROM readings c WHERE c.corrects_id = m.id)
     ORDER BY CAST(m.value AS ${real}) ${order}, m.id LIMIT 1)`;

/** Sums up the standing logger readings of the groups `where` picks, from the readings table. */
const summed = (where: string, real = 'REAL') =>
  `INSERT INTO logger_summaries (batch_id, control, readings, first_at, last_at, lowest, highest)
   SELECT x.batch_id, x.control, COUNT(*), MIN(x.taken_at), MAX(x.taken_at),
     ${extreme('ASC', real)}, ${extreme('DESC', real)}
   FROM readings x WHERE ${where} AND ${STANDING}
   GROUP BY x.batch_id, x.control`;

/**
 * Sums up one batch's control again from its readings (a correction took a reading out, or a row
 * changed): `batch` and `control` are SQL expressions over the trigger's row.
 */
const again = (batch: string, control: string) => `
    DELETE FROM logger_summaries WHERE batch_id = ${batch} AND control = ${control};
    ${summed(`x.batch_id = ${batch} AND x.control = ${control}`)};`;

/** The batch and control of the reading a row corrects, as expressions. */
const corrected = (row: 'NEW' | 'OLD'): [string, string] => [
  `(SELECT batch_id FROM readings WHERE id = ${row}.corrects_id)`,
  `(SELECT control FROM readings WHERE id = ${row}.corrects_id)`,
];

const STATEMENTS = [
  `CREATE TABLE logger_summaries (
    batch_id INTEGER NOT NULL REFERENCES batches(id),
    control TEXT NOT NULL,
    readings INTEGER NOT NULL,
    first_at TEXT NOT NULL,
    last_at TEXT NOT NULL,
    lowest TEXT NOT NULL,
    highest TEXT NOT NULL,
    PRIMARY KEY (batch_id, control)
  ) WITHOUT ROWID`,
  // A logger reading written: one more, and the times and extremes widened. The upsert keeps the
  // row already there on an equal value: it was written first (ids only grow).
  `CREATE TRIGGER logger_summaries_add AFTER INSERT ON readings
   WHEN NEW.source = 'logger' AND NEW.batch_id IS NOT NULL AND NEW.corrects_id IS NULL
     AND NOT EXISTS (SELECT 1 FROM readings c WHERE c.corrects_id = NEW.id)
   BEGIN
     INSERT INTO logger_summaries (batch_id, control, readings, first_at, last_at, lowest, highest)
     VALUES (NEW.batch_id, NEW.control, 1, NEW.taken_at, NEW.taken_at, NEW.value, NEW.value)
     ON CONFLICT (batch_id, control) DO UPDATE SET
       readings = readings + 1,
       first_at = min(first_at, excluded.first_at),
       last_at = max(last_at, excluded.last_at),
       lowest = CASE WHEN CAST(excluded.lowest AS REAL) < CAST(lowest AS REAL)
         THEN excluded.lowest ELSE lowest END,
       highest = CASE WHEN CAST(excluded.highest AS REAL) > CAST(highest AS REAL)
         THEN excluded.highest ELSE highest END;
   END`,
  // A correction: the reading it names no longer stands. Rare, so both groups are summed again.
  `CREATE TRIGGER logger_summaries_correct AFTER INSERT ON readings
   WHEN NEW.corrects_id IS NOT NULL
   BEGIN ${again(...corrected('NEW'))} ${again('NEW.batch_id', 'NEW.control')} END`,
  // Records are never changed in place; should a row be changed or removed by hand all the same,
  // every group it touches is summed again.
  `CREATE TRIGGER logger_summaries_update AFTER UPDATE ON readings
   BEGIN ${again('OLD.batch_id', 'OLD.control')} ${again('NEW.batch_id', 'NEW.control')}
     ${again(...corrected('OLD'))} ${again(...corrected('NEW'))} END`,
  `CREATE TRIGGER logger_summaries_delete AFTER DELETE ON readings
   BEGIN ${again('OLD.batch_id', 'OLD.control')} ${again(...corrected('OLD'))} END`,
  summed('1 = 1'),
  // The readings a person entered: a few a batch among a logger's thousands.
  `CREATE INDEX readings_by_hand ON readings (batch_id, control, taken_at, id)
   WHERE source <> 'logger'`,
];

// PostgreSQL's REAL is 4 bytes; SQLite's is 8, which is DOUBLE PRECISION.
const DOUBLE = 'DOUBLE PRECISION';

/**
 * The same table kept by PostgreSQL's triggers, which call functions: one sums up a batch's
 * control again, one handles a reading written, one a reading changed or removed.
 */
const POSTGRES_STATEMENTS = [
  STATEMENTS[0],
  `CREATE FUNCTION logger_summaries_again(b BIGINT, c TEXT) RETURNS void LANGUAGE plpgsql AS $fn$
   BEGIN
     DELETE FROM logger_summaries WHERE batch_id = b AND control = c;
     ${summed('x.batch_id = b AND x.control = c', DOUBLE)};
   END $fn$`,
  `CREATE FUNCTION logger_summaries_written() RETURNS trigger LANGUAGE plpgsql AS $fn$
   BEGIN
     IF NEW.source = 'logger' AND NEW.batch_id IS NOT NULL AND NEW.corrects_id IS NULL
       AND NOT EXISTS (SELECT 1 FROM readings c WHERE c.corrects_id = NEW.id) THEN
       INSERT INTO logger_summaries AS s (batch_id, control, readings, first_at, last_at, lowest, highest)
       VALUES (NEW.batch_id, NEW.control, 1, NEW.taken_at, NEW.taken_at, NEW.value, NEW.value)
       ON CONFLICT (batch_id, control) DO UPDATE SET
         readings = s.readings + 1,
         first_at = LEAST(s.first_at, excluded.first_at),
         last_at = GREATEST(s.last_at, excluded.last_at),
         lowest = CASE WHEN CAST(excluded.lowest AS ${DOUBLE}) < CAST(s.lowest AS ${DOUBLE})
           THEN excluded.lowest ELSE s.lowest END,
         highest = CASE WHEN CAST(excluded.highest AS ${DOUBLE}) > CAST(s.highest AS ${DOUBLE})
           THEN excluded.highest ELSE s.highest END;
     END IF;
     IF NEW.corrects_id IS NOT NULL THEN
       PERFORM logger_summaries_again(${corrected('NEW').join(', ')});
       PERFORM logger_summaries_again(NEW.batch_id, NEW.control);
     END IF;
     RETURN NULL;
   END $fn$`,
  `CREATE FUNCTION logger_summaries_changed() RETURNS trigger LANGUAGE plpgsql AS $fn$
   BEGIN
     PERFORM logger_summaries_again(OLD.batch_id, OLD.control);
     PERFORM logger_summaries_again(${corrected('OLD').join(', ')});
     IF TG_OP = 'UPDATE' THEN
       PERFORM logger_summaries_again(NEW.batch_id, NEW.control);
       PERFORM logger_summaries_again(${corrected('NEW').join(', ')});
     END IF;
     RETURN NULL;
   END $fn$`,
  `CREATE TRIGGER logger_summaries_add AFTER INSERT ON readings
   FOR EACH ROW EXECUTE FUNCTION logger_summaries_written()`,
  `CREATE TRIGGER logger_summaries_update AFTER UPDATE OR DELETE ON readings
   FOR EACH ROW EXECUTE FUNCTION logger_summaries_changed()`,
  summed('1 = 1', DOUBLE),
  STATEMENTS[STATEMENTS.length - 1],
];

export async function up(queryInterface: QueryInterface): Promise<void> {
  await runStatements(
    queryInterface,
    onPostgres(queryInterface) ? POSTGRES_STATEMENTS : STATEMENTS,
  );
}
