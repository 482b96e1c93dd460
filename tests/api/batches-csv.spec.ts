import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { parseListQuery } from '../../server/batches/batch-query.ts';
import { parseCsv } from '../helpers/csv.ts';
import { clockFrom, startTestServer } from '../helpers/test-server.ts';

// The server's today near the fixed start days below (a start lies within a year of today).
const SERVER_CLOCK = clockFrom('2023-05-08');

const HEADER = [
  'lot_code',
  'formula_id',
  'formula_revision',
  'formula_title',
  'kind',
  'status',
  'operator',
  'started_on',
  'ready_on',
  'recorded_at',
  'updated_at',
  'units',
  'inputs',
  'checks_passed',
  'nitrite_ppm',
  'signed_off_by',
  'signed_off_at',
  'discard_reason',
  'notes',
];

describe('exporting batches as CSV', () => {
  it('should export exactly the filtered batches in the list’s order, formulas defused', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const tobin = await server.signIn('tobin');
    const notes = [
      '=HYPERLINK("http://example.invalid","click")',
      '@SUM(1+1)',
      '+1 belly short',
      '-2 °C in the walk-in, "checked", twice\nsecond line',
    ];
    for (const [i, note] of notes.entries()) {
      const response = await tobin.post('/api/batches', {
        formula: i % 2 ? 'brisket-rub' : 'quillmoor-belly',
        batch:
          i % 2
            ? { base: '1kg', start: '2023-05-05' }
            : {
                meat: '4.26kg',
                thickness: '4cm',
                start: '2023-05-05',
              },
        notes: note,
      });
      assert.equal(response.status, 201, response.text);
    }
    // A batch outside the filter.
    await tobin.post('/api/batches', {
      formula: 'brisket-rub',
      batch: { base: '1kg', start: '2023-05-06' },
    });

    const response = await server.as('imke').get('/api/batches.csv?lot=230505&sort=lot&order=asc');
    assert.equal(response.status, 200, response.text);
    assert.equal(response.headers.get('content-type'), 'text/csv; charset=utf-8');
    assert.match(
      response.headers.get('content-disposition') ?? '',
      /^attachment; filename="larderbook-batches-\d{4}-\d{2}-\d{2}\.csv"$/,
    );
    const [header, ...rows] = parseCsv(response.text);
    assert.deepEqual(header, HEADER);
    const list = await server.as('imke').get('/api/batches?lot=230505&sort=lot&order=asc');
    assert.deepEqual(
      rows.map((row) => row[0]),
      list.json.items.map((b: { lotCode: string }) => b.lotCode),
    );
    assert.deepEqual(
      rows.map((row) => row[0]),
      ['230505-BR-01', '230505-BR-02', '230505-QB-01', '230505-QB-02'],
    );
    const byLot = new Map(
      rows.map((row) => [row[0], Object.fromEntries(HEADER.map((h, i) => [h, row[i]]))]),
    );
    const belly = byLot.get('230505-QB-01') ?? {};
    assert.equal(belly.notes, `'${notes[0]}`);
    assert.equal(byLot.get('230505-QB-02')?.notes, `'${notes[2]}`);
    assert.equal(byLot.get('230505-BR-01')?.notes, `'${notes[1]}`);
    assert.equal(byLot.get('230505-BR-02')?.notes, `'${notes[3]}`);
    // source: USDA FSIS Directive 7620.3 ch. 3, dry-cure formula: 0.25 % × 6.25 % × 10^6
    assert.equal(belly.nitrite_ppm, '156.25');
    assert.equal(belly.inputs, 'start=2023-05-05; meat=4.26kg; thickness=4cm');
    assert.equal(belly.checks_passed, 'yes');
    assert.equal(belly.status, 'in-progress');
    assert.equal(belly.operator, 'Tobin Marrowfeld (cook)');
    assert.equal(belly.formula_title, 'Quillmoor belly, dry equilibrium cure');
    assert.equal(byLot.get('230505-BR-01')?.nitrite_ppm, '');
    // No cell a spreadsheet would take for a formula.
    for (const row of rows) for (const cell of row) assert.doesNotMatch(cell, /^[=+\-@\t\r]/);
  });

  it('should export the whole log along the keyset, page after page', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    const response = await server.as('tobin').get('/api/batches.csv?sort=started');
    assert.equal(response.status, 200);
    const [, ...rows] = parseCsv(response.text);
    const total = (await server.as('tobin').get('/api/batches?limit=1')).json.total as number;
    assert.ok(total > 20, 'the demo weeks are there');
    assert.equal(rows.length, total);
    assert.equal(new Set(rows.map((row) => row[0])).size, total);
    // Small pages give the same rows in the same order as one big one.
    const query = parseListQuery({ sort: 'started' }, false);
    const paged: string[] = [];
    for await (const page of server.context.batches.summaryPages(query, 7))
      paged.push(...page.map((b) => b.lotCode));
    assert.deepEqual(
      paged,
      rows.map((row) => row[0]),
    );
  });

  it('should answer bad export parameters with a JSON error', async (t) => {
    const server = await startTestServer(t, {}, { now: SERVER_CLOCK });
    for (const query of ['limit=10', 'cursor=abc', 'status=cooking', 'sort=weight']) {
      const response = await server.as('imke').get(`/api/batches.csv?${query}`);
      assert.equal(response.status, 400, query);
      assert.equal(response.json.error.code, 'bad-request', query);
    }
  });
});
