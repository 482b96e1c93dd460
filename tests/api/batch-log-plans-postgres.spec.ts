import assert from 'node:assert/strict';
import { after, before, describe, it } from 'node:test';
import { QueryTypes, type Transaction } from 'sequelize';
import { parseListQuery, type ListQuery } from '../../server/batches/batch-query.ts';
import { TOTAL_COUNTED } from '../../server/batches/batch-repository.ts';
import { countSql, pageSql, type SqlPart } from '../../server/batches/batch-sql.ts';
import { testPostgresUrl } from '../helpers/test-database.ts';
import { startTestServer, type TestServer } from '../helpers/test-server.ts';

/**
 * Batches seeded beside the demo's: enough that, once ANALYZE has counted them, reading the whole
 * table costs the planner far more than walking an index to a page of 51, so a plan that scans
 * batches means no index serves the query (a demo-sized table is scanned whatever its indexes).
 */
const SEEDED = 60_000;

/** A node of EXPLAIN (FORMAT JSON)'s plan tree. */
interface PlanNode {
  'Node Type': string;
  'Relation Name'?: string;
  Filter?: string;
  Plans?: PlanNode[];
}

/** Every node of a plan, the root first. */
function nodesOf(node: PlanNode): PlanNode[] {
  return [node, ...(node.Plans ?? []).flatMap(nodesOf)];
}

/**
 * The scans of the whole batches table in a plan. One with no filter directly under a Limit is
 * not counted: it stops after the limit's rows, as an unfiltered capped count does.
 */
function tableScans(root: PlanNode): PlanNode[] {
  const underLimit = new Set(
    nodesOf(root)
      .filter((node) => node['Node Type'] === 'Limit')
      .flatMap((node) => node.Plans ?? []),
  );
  return nodesOf(root).filter(
    (node) =>
      node['Node Type'] === 'Seq Scan' &&
      node['Relation Name'] === 'batches' &&
      !(underLimit.has(node) && node.Filter === undefined),
  );
}

// Registered only on PostgreSQL (`npm run test:pg`): on SQLite the file holds no test, and
// SQLite's own plans are checked by batches-list.spec.ts.
if (testPostgresUrl())
  describe('the batch log’s query plans on PostgreSQL', () => {
    let server: TestServer;
    const stops: (() => unknown)[] = [];
    /** The log's four pages as the benchmark reads them (bench/batch-log.ts). */
    const queries: [string, ListQuery][] = [];

    before(async () => {
      server = await startTestServer({ after: (fn) => void stops.push(fn) });
      const { sequelize } = server.context.db;
      // Each seeded batch a copy of a demo batch but for what the log's queries read: a lot code of
      // its own, a moment every 90 s over about two months, mostly done (one in 20 discarded).
      const columns = await sequelize.query<{ name: string }>(
        `SELECT column_name AS name FROM information_schema.columns
       WHERE table_name = 'batches' AND is_generated = 'NEVER' AND column_name <> 'id'
       ORDER BY ordinal_position`,
        { type: QueryTypes.SELECT },
      );
      const given: Record<string, string> = {
        lot_code: "'260101-SD-' || lpad(g::text, 6, '0')",
        status: "CASE WHEN g % 20 = 0 THEN 'discarded' ELSE 'done' END",
        recorded_at: 'moment',
        updated_at: 'moment',
        started_on: 'left(moment, 10)',
        result: "'{}'",
        nitrite_ppm: 'NULL',
      };
      const names = columns.map((column) => column.name);
      await sequelize.query(
        `WITH demo AS (SELECT *, row_number() OVER (ORDER BY id) - 1 AS n FROM batches)
       INSERT INTO batches (${names.join(', ')})
       SELECT ${names.map((name) => given[name] ?? `t.${name}`).join(', ')}
       FROM generate_series(1, ${SEEDED}) g
       CROSS JOIN LATERAL (SELECT to_char(timestamp '2025-11-01' + g * interval '90 seconds',
         'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"') AS moment) m
       JOIN demo t ON t.n = g % (SELECT count(*) FROM demo)`,
      );
      await sequelize.query('VACUUM ANALYZE batches');
      const [deep] = await sequelize.query<{ recorded_at: string; id: number }>(
        'SELECT recorded_at, id FROM batches ORDER BY recorded_at DESC, id DESC LIMIT 1 OFFSET ?',
        { replacements: [Math.floor(SEEDED / 2)], type: QueryTypes.SELECT },
      );
      const first = parseListQuery({ limit: '50' }, true);
      queries.push(
        ['first page', first],
        [
          'filtered page (formula + status)',
          parseListQuery({ formula: 'quillmoor-belly', status: 'done', limit: '50' }, true),
        ],
        [
          'page deep in the list (half-way)',
          { ...first, cursor: { key: deep.recorded_at, id: deep.id, direction: 'next' } },
        ],
        ['lot-code search', parseListQuery({ lot: '260101-SD-03', limit: '50' }, true)],
      );
    });
    after(async () => {
      for (const stop of stops.reverse()) await stop();
    });

    /** The plan PostgreSQL picks for a statement, as the server binds it. */
    const planOf = async (
      { sql, values }: SqlPart,
      transaction?: Transaction,
    ): Promise<PlanNode> => {
      const [row] = await server.context.db.sequelize.query<{ 'QUERY PLAN': { Plan: PlanNode }[] }>(
        `EXPLAIN (FORMAT JSON) ${sql}`,
        {
          replacements: [...values],
          type: QueryTypes.SELECT,
          ...(transaction ? { transaction } : {}),
        },
      );
      return row['QUERY PLAN'][0].Plan;
    };

    /** Each of the four pages and its capped count, labelled. */
    const statements = (): [string, SqlPart][] =>
      queries.flatMap(([label, query]): [string, SqlPart][] => [
        [label, pageSql(query, 'list', 'postgres')],
        [`${label}, counted`, countSql(query.filter, TOTAL_COUNTED, 'postgres')],
      ]);

    it('should read the four pages and their counts through indexes, never a scan of batches', async () => {
      assert.equal(queries.length, 4);
      for (const [label, part] of statements()) {
        const plan = await planOf(part);
        assert.deepEqual(tableScans(plan), [], `${label}: ${JSON.stringify(plan)}`);
      }
    });

    it('should see the scan when the log’s indexes are gone, so the check above can fail', async () => {
      const { sequelize } = server.context.db;
      // The indexes are dropped in a transaction that is rolled back: the plans are read inside it.
      await sequelize
        .transaction(async (transaction) => {
          const indexes = await sequelize.query<{ name: string }>(
            `SELECT indexrelid::regclass::text AS name FROM pg_index
             WHERE indrelid = 'batches'::regclass
               AND indexrelid NOT IN (SELECT conindid FROM pg_constraint)`,
            { type: QueryTypes.SELECT, transaction },
          );
          assert.ok(indexes.length > 3, 'the log has its indexes to drop');
          for (const { name } of indexes)
            await sequelize.query(`DROP INDEX ${name}`, { transaction });
          // The pages but the lot-code search, which walks lot_code's UNIQUE constraint (kept).
          const pages = statements().filter(([label]) => !/lot-code|counted/.test(label));
          assert.equal(pages.length, 3);
          for (const [label, part] of pages) {
            const plan = await planOf(part, transaction);
            assert.notDeepEqual(tableScans(plan), [], `${label}: ${JSON.stringify(plan)}`);
          }
          throw new RolledBack();
        })
        .catch((error: unknown) => {
          if (!(error instanceof RolledBack)) throw error;
        });
    });
  });

/** Thrown to roll the transaction of dropped indexes back. */
class RolledBack extends Error {}
