import assert from 'node:assert/strict';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, it } from 'node:test';
import jsqr from 'jsqr';
import { today } from '../../cli/io.ts';
import { drawQrCode } from '../../server/pdf/qr-code.ts';
import { addDays } from '../../shared/index.ts';
import { pdfText } from '../helpers/pdf-text.ts';
import { assertExit, runLarder, stdoutJson } from '../helpers/run-larder.ts';
import { makeTempDir } from '../helpers/temp-files.ts';
import { PASSWORDS, startTestServer, type TestServer } from '../helpers/test-server.ts';
import { BELLY } from '../helpers/api-calls.ts';

// jsqr is CommonJS with its function on `default` as well as the module itself.
const jsQR = jsqr.default;

const BELLY_CALC = ['calc', 'quillmoor-belly', '--meat', '4.26kg', '--thickness', '4cm'];

/** The demo belly at 4.26 kg, worked by hand from formulas/quillmoor-belly.yaml. */
const BELLY_FIGURES = [
  // Green weight as given (its label printed in capitals).
  /Green weight 4260 g/i,
  // Curing salt 0.25 % × 4260 g = 10.65 g, weighed to 0.1 g rounding half up: 10.7 g.
  /curing salt no\. 1 \(6\.25 % nitrite\).* 0\.25 % 10\.7 g/,
  // Salt 2.25 % × 4260 g = 95.85 g → 95.9 g (under 100 g: to 0.1 g).
  /fine sea salt 2\.25 % 95\.9 g/,
  // 0.25 % × 6.25 % × 10^6 = 156.25 ppm, printed to 0.1 ppm.
  // source: USDA FSIS Directive 7620.3, Processing Inspectors' Calculations Handbook, ch. 3
  /156\.3 ppm/,
  // Hold: 2 days per cm × 4 cm = 8 days. source: the formula's own hold rule
  /8 days/,
];

/** `larder plan ASSEMBLY --pdf` for service on 2026-12-18, planned 2026-12-02: the PDF's text. */
async function planPdf(
  t: { after(fn: () => unknown): void },
  assembly: string,
  count: number,
): Promise<Awaited<ReturnType<typeof pdfText>>> {
  const file = path.join(makeTempDir(t), `${assembly}.pdf`);
  const run = await runLarder([
    ...['plan', assembly, '--count', String(count), '--for', '2026-12-18'],
    ...['--today', '2026-12-02', '--pdf', file],
  ]);
  assertExit(run, 0);
  assert.ok(existsSync(file));
  return pdfText(readFileSync(file));
}

/** GET or POST a PDF from the API with Basic auth; the raw bytes. */
async function fetchPdf(
  server: TestServer,
  route: string,
  body?: unknown,
): Promise<{ status: number; type: string | null; bytes: Uint8Array }> {
  const auth = Buffer.from(`tobin:${PASSWORDS.tobin}`).toString('base64');
  const response = await fetch(server.url + route, {
    method: body === undefined ? 'GET' : 'POST',
    headers: {
      authorization: `Basic ${auth}`,
      ...(body === undefined ? {} : { 'content-type': 'application/json' }),
    },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  return {
    status: response.status,
    type: response.headers.get('content-type'),
    bytes: new Uint8Array(await response.arrayBuffer()),
  };
}

/**
 * Draws a QR code through drawQrCode onto a stand-in for the PDF page that records its squares,
 * rasterises them (white page, black squares) and reads the code back with jsQR.
 */
function readDrawnQrCode(text: string): string | undefined {
  const PX = 4;
  const squares: [number, number, number, number, string][] = [];
  let pending: [number, number, number, number][] = [];
  let colour = '#000000';
  const page = {
    save: () => page,
    restore: () => page,
    rect(x: number, y: number, w: number, h: number) {
      pending.push([x, y, w, h]);
      return page;
    },
    fillColor(c: string) {
      colour = c;
      return page;
    },
    fill() {
      for (const r of pending) squares.push([...r, colour]);
      pending = [];
      return page;
    },
  };
  const side = drawQrCode(page as unknown as PDFKit.PDFDocument, text, 0, 0, 1);
  const size = Math.ceil(side) * PX;
  const pixels = new Uint8ClampedArray(size * size * 4).fill(255);
  for (const [x, y, w, h, c] of squares) {
    const value = c === '#ffffff' ? 255 : 0;
    for (let row = y * PX; row < (y + h) * PX; row++)
      for (let col = x * PX; col < (x + w) * PX; col++)
        pixels.fill(value, (row * size + col) * 4, (row * size + col) * 4 + 3);
  }
  return jsQR(pixels, size, size)?.data;
}

/** 2026-12-09 as the sheets print it: "9 Dec 2026". */
function dayWords(day: string): string {
  const [year, month, date] = day.split('-').map(Number);
  const months = 'Jan Feb Mar Apr May Jun Jul Aug Sep Oct Nov Dec'.split(' ');
  return `${date} ${months[month - 1]} ${year}`;
}

describe('the lot code as a QR code', () => {
  it('should draw a code that an independent reader decodes to the lot code', () => {
    // source: ISO/IEC 18004:2015 QR code, decoded by jsQR (a reader separate from the encoder)
    for (const lot of ['261202-QB-01', '261218-CG-12', '270101-SB-99']) {
      assert.equal(readDrawnQrCode(lot), lot);
    }
  });
});

describe('batch sheets as PDF from the command line', () => {
  it('should write a calculation’s sheet with every quantity, the checks and lines to sign', async (t) => {
    const dir = makeTempDir(t);
    const file = path.join(dir, 'belly.pdf');
    const run = await runLarder([...BELLY_CALC, '--pdf', file]);
    assertExit(run, 0);
    assert.match(run.stdout, /Wrote the batch sheet to/);
    const sheet = await pdfText(readFileSync(file));
    assert.equal(sheet.title, 'Quillmoor belly, dry equilibrium cure');
    for (const figure of BELLY_FIGURES) assert.match(sheet.all, figure);
    assert.match(sheet.all, /Lot not recorded/);
    assert.match(sheet.all, /PASS Ingoing sodium nitrite/);
    assert.match(sheet.all, /Curing salt is poisonous/);
    assert.match(sheet.all, /Weighed by .*Checked by/s);
  });

  it('should name the species of fish among a sheet’s allergens', async (t) => {
    const file = path.join(makeTempDir(t), 'sauce.pdf');
    assertExit(await runLarder(['calc', 'house-sauce', '--total', '2kg', '--pdf', file]), 0);
    const sheet = await pdfText(readFileSync(file));
    // Egg (mayonnaise) and anchovy (Worcestershire sauce). source: 21 U.S.C. 343(w)(2) (the
    // species of fish is named); formulas/house-sauce.yaml
    assert.match(sheet.all, /Contains: egg, fish \(anchovy\)/);
  });

  it('should print the bun dough and its sponge with one weight each', async (t) => {
    const file = path.join(makeTempDir(t), 'bun.pdf');
    assertExit(await runLarder(['calc', 'pit-bun', '--pieces', '48', '--pdf', file]), 0);
    const sheet = await pdfText(readFileSync(file));
    // 48 × 90 g ÷ 0.97 = 4453.608 g of dough; sponge 30 % × 2381.609 g × 1.803 = 1288.212 g.
    // source: "Bread Formula Construction" (2011) for the loss; Bread Bakers Guild of America
    // formula layout standards (2009); own example, derived
    assert.match(sheet.all, /sponge .*1288\.2 g/);
    assert.match(sheet.all, /the exact weight is 4453\.6 g/);
    assert.match(sheet.all, /Mixed dough 4453\.6 g/i);
    assert.doesNotMatch(sheet.all, /4454 g|1288 g/);
    assert.match(sheet.all, /the other 133\.6 g is the loss allowance/);
  });

  it('should not replace a file without --force, and replace it with', async (t) => {
    const file = path.join(makeTempDir(t), 'taken.pdf');
    writeFileSync(file, 'keep me');
    const refused = await runLarder([...BELLY_CALC, '--pdf', file]);
    assertExit(refused, 2);
    assert.match(refused.stderr, /already exists: add --force/);
    assert.equal(readFileSync(file, 'utf8'), 'keep me');
    assertExit(await runLarder([...BELLY_CALC, '--pdf', file, '--force']), 0);
    assert.match((await pdfText(readFileSync(file))).all, /10\.7 g/);
  });

  it('should print a recorded batch’s lot code, from --record and from batches show', async (t) => {
    const dir = makeTempDir(t);
    const data = path.join(dir, 'data');
    const add = await runLarder(['users', 'add', 'tobin', '--role', 'cook'], {
      env: { LARDER_DATA: data, LARDER_NEW_PASSWORD: 'tobin-pass-1' },
    });
    assertExit(add, 0);
    const env = { LARDER_DATA: data, LARDER_USER: 'tobin', LARDER_PASSWORD: 'tobin-pass-1' };
    const recordedFile = path.join(dir, 'recorded.pdf');
    // Yesterday on this machine's clock: a start must lie within a year of it.
    const start = addDays(today(), -1);
    const recorded = await runLarder(
      [...BELLY_CALC, '--start', start, '--record', '--json', '--pdf', recordedFile],
      { env },
    );
    assertExit(recorded, 0);
    // source: our lot code format (server/README.md "Batches"): start day, formula initials,
    // sequence
    const lot = stdoutJson<{ lotCode: string }>(recorded).lotCode;
    assert.equal(lot, `${start.slice(2).replaceAll('-', '')}-QB-01`);
    const first = await pdfText(readFileSync(recordedFile));
    assert.match(first.pages[0], new RegExp(`Lot ${lot}`));
    for (const figure of BELLY_FIGURES) assert.match(first.all, figure);

    const shownFile = path.join(dir, 'shown.pdf');
    assertExit(await runLarder(['batches', 'show', lot, '--pdf', shownFile], { env }), 0);
    const shown = await pdfText(readFileSync(shownFile));
    assert.match(shown.pages[0], new RegExp(`Lot ${lot}`));
    assert.match(shown.all, /OPERATOR tobin/);
    for (const figure of BELLY_FIGURES) assert.match(shown.all, figure);

    const missing = await runLarder(['batches', 'show', '261202-QB-99', '--pdf', shownFile], {
      env,
    });
    assert.notEqual(missing.code, 0);
  });
});

describe('sheets as PDF from the API', () => {
  it('should answer a recorded batch’s sheet with its lot code and quantities', async (t) => {
    const server = await startTestServer(t);
    const recorded = await server.as('tobin').post('/api/batches', BELLY);
    assert.equal(recorded.status, 201, recorded.text);
    const lot = recorded.json.batch.lotCode as string;
    const pdf = await fetchPdf(server, `/api/batches/${lot}/sheet.pdf`);
    assert.equal(pdf.status, 200);
    assert.equal(pdf.type, 'application/pdf');
    const sheet = await pdfText(pdf.bytes);
    assert.match(sheet.pages[0], new RegExp(`Lot ${lot}`));
    // The demo belly is recorded at 4.26 kg (tests/helpers/api-calls.ts): same figures as above.
    for (const figure of BELLY_FIGURES) assert.match(sheet.all, figure);
    assert.equal((await fetchPdf(server, '/api/batches/261202-QB-99/sheet.pdf')).status, 404);
  });

  it('should print a plan as an overview and one production sheet per start day', async (t) => {
    const server = await startTestServer(t);
    // Far enough ahead that the belly's 8-day hold and its 2 days of smoking fit before service.
    const service = addDays(new Date().toISOString().slice(0, 10), 30);
    const request = { assembly: 'smokehouse-burger', count: 120, for: service };
    const pdf = await fetchPdf(server, '/api/plans/sheet.pdf', request);
    assert.equal(pdf.status, 200);
    assert.equal(pdf.type, 'application/pdf');
    const sheet = await pdfText(pdf.bytes);
    // Belly starts 8 + 2 days before service (hold, then rinse and dry, smoke and chill), the
    // bun (sponge) 1 day before, the grind and sauce on the day: three start days.
    // source: the demo formulas' hold and lead days (common practice, no source)
    const days = [addDays(service, -10), addDays(service, -1), service];
    // Each day's sheet starts a page of its own, headed "DAY n OF 3"; it may run onto more.
    const starts = sheet.pages.flatMap((page, i) =>
      /PRODUCTION SHEET · DAY/.test(page) ? [i] : [],
    );
    assert.equal(starts.length, days.length, 'one sheet per start day');
    const daySheets = starts.map((start, n) =>
      sheet.pages.slice(start, starts[n + 1] ?? sheet.pages.length).join('\n'),
    );
    daySheets.forEach((text, n) => {
      assert.match(text, new RegExp(`DAY ${n + 1} OF 3 Start ${dayWords(days[n])}`));
    });
    assert.match(sheet.pages[0], /PRODUCTION PLAN Smokehouse burger × 120/);
    // The species of fish is named. source: 21 U.S.C. 343(w)(2); formulas/house-sauce.yaml
    assert.match(sheet.pages[0], /Contains: milk, egg, fish \(anchovy\), wheat/);
    // 120 burgers × 2 portions = 240 portions of the grind; × 1 bun = 120 pieces;
    // × 20 g sauce = 2400 g; × 3 slices × 25 g = 9000 g of sliced bacon.
    assert.match(sheet.all, /240 portions of 4 oz/);
    assert.match(sheet.all, /120 pieces of 90 g/);
    assert.match(sheet.all, /20 g each = 2400 g/);
    assert.match(sheet.all, /3 slices of 25 g each = 9000 g sliced/);
    assert.match(daySheets[0], /Quillmoor belly/);
    assert.match(daySheets[2], /Smokehouse burger grind/);

    const refused = await server
      .as('tobin')
      .post('/api/plans/sheet.pdf', { ...request, for: addDays(service, -60) });
    assert.equal(refused.status, 422);
    assert.equal(refused.json.error.code, 'plan-refused');
  });

  it('should write a plan’s PDF from larder plan --pdf', async (t) => {
    const sheet = await planPdf(t, 'smokehouse-burger', 120);
    // 18 Dec − (8 hold + 2 lead) days = 8 Dec for the belly; 17 Dec for the bun; 18 Dec for
    // grind and sauce. source: the demo formulas' hold and lead days
    assert.match(sheet.all, /DAY 1 OF 3 Start 8 Dec 2026/);
    assert.match(sheet.all, /DAY 2 OF 3 Start 17 Dec 2026/);
    assert.match(sheet.all, /DAY 3 OF 3 Start 18 Dec 2026/);
  });

  it('should print the rub of the sandwich next to the brisket it goes on, with its day', async (t) => {
    const sheet = await planPdf(t, 'corned-beef-sandwich', 60);
    // Brisket: 9 days' hold + 2 lead days before 18 Dec = 7 Dec, out of the brine 16 Dec; the
    // rub goes on then, so it starts 16 Dec. source: the demo formulas' hold rule and lead days
    assert.match(sheet.pages[0], /Gets: Beef rub, salt and pepper forward, 16 Dec 2026/);
    assert.match(sheet.pages[0], /Goes on: Brisket flat, equilibrium brine, 16 Dec 2026/);
    assert.match(sheet.all, /DAY 2 OF 4 Start 16 Dec 2026/);
  });

  it('should name the formulas of a plan by title, with no column left empty and no raw dates', async (t) => {
    const sheet = await planPdf(t, 'corned-beef-sandwich', 60);
    // No raw material of the sandwich is trimmed (formulas/*.yaml): no "Before trim" column.
    assert.doesNotMatch(sheet.pages[0], /Before trim/);
    assert.match(sheet.pages[0], /PULL LIST Raw material Amount Used by/);
    assert.match(sheet.pages[0], /bread flour \S+ g Milk and honey bun, with sponge/);
    assert.doesNotMatch(sheet.all, /Used by[^]*\b(brisket-rub|house-sauce|pit-bun)\b(?!\))/);
    assert.doesNotMatch(sheet.all, /\b20\d\d-\d\d-\d\d\b/);
    assert.doesNotMatch(sheet.all, / --[a-z]/);
  });
});
