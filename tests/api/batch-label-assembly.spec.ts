import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import {
  BACON_PACK,
  madeBatch as made,
  madeFrom,
  writeAssembly,
} from '../helpers/assembly-label-fixture.ts';
import { fetchLabel } from '../helpers/batch-calls.ts';
import { recordAssembly } from '../helpers/lot-use-fixture.ts';
import { pdfText } from '../helpers/pdf-text.ts';
import { clockFrom, startTestServer, type TestServer } from '../helpers/test-server.ts';

// A fixed day years before the demo's, which is seeded around the real today: none of this
// test's lot codes can meet one of the demo's.
const CLOCK = clockFrom('2020-12-03');
const BURGER = { id: 'smokehouse-burger', title: 'Smokehouse burger' };

/** A label PDF as the API answers it, read back with pdf.js. */
async function pdfOf(server: TestServer, route: string) {
  const { status, bytes } = await fetchLabel(server, route);
  assert.equal(status, 200, `${status} ${Buffer.from(bytes).toString()}`);
  return pdfText(bytes);
}

describe('the label of an assembly batch', () => {
  it('should list the burger’s parts by weight, each with its own ingredients, once they are recorded', async (t) => {
    const server = await startTestServer(t, {}, { now: CLOCK });
    const grind = await made(server, 'chuck-grind', { want: '5 kg', start: '2020-12-02' });
    const buns = await made(server, 'pit-bun', { pieces: '24', start: '2020-12-02' });
    const belly = await made(server, 'quillmoor-belly', {
      meat: '4.26kg',
      thickness: '4cm',
      start: '2020-11-20',
    });
    const sauce = await made(server, 'house-sauce', { total: '2 kg', start: '2020-12-01' });
    const burgers = await recordAssembly(server, BURGER.id, '2020-12-03');
    const rosa = server.as('rosa');

    // Nothing recorded yet: the label would not know what went into each part.
    // The preview is told why as content; the PDF is refused.
    const early = await rosa.get(`/api/batches/${burgers}/label`);
    assert.equal(early.status, 200, early.text);
    const earlyPdf = await rosa.get(`/api/batches/${burgers}/label.pdf?size=4x6&net=20+oz`);
    assert.equal(earlyPdf.status, 409, earlyPdf.text);
    assert.equal(earlyPdf.json.error.code, 'parts-not-recorded');
    assert.equal(early.json.notYet, earlyPdf.json.error.message);
    assert.match(
      early.json.notYet,
      /none is recorded for Smokehouse burger grind 80\/20, Milk and honey bun, with sponge, Quillmoor belly, dry equilibrium cure, Pit-house sandwich sauce$/,
    );

    // 20 burgers: 2 × 4 oz of grind, a bun, 3 slices of 25 g, 20 g of sauce each.
    await madeFrom(server, burgers, [
      ['chuck-grind', grind, '4.54 kg'],
      ['pit-bun', buns, '1.8 kg'],
      ['quillmoor-belly', belly, '1.5 kg'],
      ['house-sauce', sauce, '400 g'],
    ]);
    const view = (await rosa.get(`/api/batches/${burgers}/label`)).json;
    // One burger, worked by hand from formulas/smokehouse-burger.yaml: grind 2 × 4 oz = 226.8 g
    // (1 oz = 28.349523125 g, NIST SP 811 (2008), B.8), bun 90 g, bacon 3 × 25 g = 75 g, sauce
    // 20 g; each part's own ingredients as its batch label lists them (the sauce's and bacon's
    // worked by hand in tests/e2e/labels.e2e.ts and shared/labels/product-label.spec.ts).
    // source: 21 CFR 101.4(a)(1) and (b)(2)(i); 9 CFR 317.2(f), from memory
    const own = async (lot: string) =>
      ((await rosa.get(`/api/batches/${lot}/label`)).json.ingredients as string).replace(
        /^Ingredients: /,
        '',
      );
    assert.equal(
      view.ingredients,
      `Ingredients: Smokehouse burger grind 80/20 (${await own(grind)}), ` +
        `Milk and honey bun, with sponge (${await own(buns)}), ` +
        'Quillmoor belly, dry equilibrium cure (pork, sea salt, brown sugar, black pepper, ' +
        `curing salt (salt, sodium nitrite)), Pit-house sandwich sauce (${await own(sauce)})`,
    );
    assert.match(view.ingredients, /sauce \(mayonnaise \(soybean oil, water, egg yolks/);
    // source: 21 U.S.C. 343(w)(1)(A) and (w)(2): the bun's milk, egg and wheat, the sauce's egg
    // and anchovy
    assert.equal(view.contains, 'Contains: milk, egg, fish (anchovy), wheat');
    // The raw grind and bacon. source: 9 CFR 381.125(b) (read); 317.2(l), from memory
    assert.equal(view.safeHandling.required, true);
    assert.equal(view.net, undefined);
    assert.match(view.netNote, /bun, with sponge is weighed as dough/);

    const noNet = await rosa.get(`/api/batches/${burgers}/label.pdf`);
    assert.equal(noNet.status, 400);
    assert.match(noNet.json.error.message, /declares the net weight .* weighed as dough/);
    const small = await rosa.get(`/api/batches/${burgers}/label.pdf?size=2x1`);
    assert.equal(small.json.error.code, 'too-small-for-safe-handling');

    // Its 929 characters of ingredients do not fit a 4 × 6 label beside the safe handling
    // instructions with letters 1/16 in tall: refused, not cut short nor set smaller.
    const full = await rosa.get(`/api/batches/${burgers}/label.pdf?size=4x6&net=14%20oz`);
    assert.equal(view.ingredients.length, 929);
    assert.equal(full.status, 422, full.text);
    assert.equal(full.json.error.code, 'label-too-full');
    // The preview says so before anyone prints: no size is offered for this label, and the
    // burger, served rather than packed, needs none.
    const refused = view.sizes.map((size: { refused?: string }) => size.refused ?? '');
    assert.match(
      refused[0],
      /^This label is too long for any size we print: the ingredient statement does not fit on a 4 × 6 label .*\(1\/16 in\), and the small labels have no room for the safe handling instructions\. A dish you serve rather than pack, such as a burger from the grill, needs no package label$/,
    );
    for (const why of refused.slice(1)) assert.match(why, /too small for the safe handling/);
  });

  it('should print packs of parts, weighed by their formula and kept as their own label key says', async (t) => {
    const server = await startTestServer(t, {}, { now: CLOCK });
    // Two packs of our own: 12 slices of 25 g of the cold-smoked belly, kept refrigerated and
    // not ready to eat; and 100 g of the cooked ham with 20 g of the house sauce, ready to eat.
    writeAssembly(server, BACON_PACK.formula, BACON_PACK.lines);
    writeAssembly(server, { id: 'test-ham-pack', title: 'Ham and sauce' }, [
      'components:',
      '  - { formula: house-sauce, amount: 20 g }',
      '  - { formula: ham-pump, amount: 100 g, largest_piece: 2 kg }',
      'label: { storage: refrigerated, ready_to_eat: true }',
    ]);
    const belly = await made(server, 'quillmoor-belly', {
      meat: '4.26kg',
      thickness: '4cm',
      start: '2020-11-20',
    });
    const ham = await made(server, 'ham-pump', {
      meat: '4 kg',
      largestPiece: '2 kg',
      start: '2020-11-25',
    });
    const sauce = await made(server, 'house-sauce', { total: '2 kg', start: '2020-12-01' });
    const bacon = await recordAssembly(server, BACON_PACK.formula.id, '2020-12-03');
    const hams = await recordAssembly(server, 'test-ham-pack', '2020-12-03');
    await madeFrom(server, bacon, [['quillmoor-belly', belly, '3 kg']]);
    await madeFrom(server, hams, [
      ['ham-pump', ham, '2 kg'],
      ['house-sauce', sauce, '400 g'],
    ]);
    const rosa = server.as('rosa');
    const own = async (lot: string) =>
      ((await rosa.get(`/api/batches/${lot}/label`)).json.ingredients as string).replace(
        /^Ingredients: /,
        '',
      );

    const bacons = (await rosa.get(`/api/batches/${bacon}/label`)).json;
    assert.equal(
      bacons.ingredients,
      'Ingredients: Quillmoor belly, dry equilibrium cure (pork, sea salt, brown sugar, ' +
        'black pepper, curing salt (salt, sodium nitrite))',
    );
    // 12 × 25 g = 300 g = 10.58 oz, rounded down. source: NIST SP 811 (2008), Appendix B.8
    assert.equal(bacons.net, 'Net wt 10.5 oz (300 g)');
    assert.match(bacons.netNote, /^the net weight of one unit by its formula/);
    assert.equal(bacons.handling, 'Keep refrigerated');
    assert.equal(
      bacons.safeHandling.reason,
      'not ready to eat, as its formula says (9 CFR 317.2(l))',
    );
    // The net weight worked out, the 4 × 6 label prints without one given.
    const baconText = await pdfOf(server, `/api/batches/${bacon}/label.pdf`);
    assert.deepEqual(baconText.sizes, [[288, 432]]);
    assert.ok(baconText.all.includes(bacons.ingredients), baconText.all);
    assert.match(baconText.all, /Net wt 10\.5 oz \(300 g\)/);
    assert.match(baconText.all, /Safe Handling Instructions This product was prepared/);
    assert.match(baconText.all, /KEEP REFRIGERATED/);

    // 100 g of ham before 20 g of sauce, though the formula names the sauce first.
    // source: 21 CFR 101.4(a)(1) and (b)(2)(i); 9 CFR 317.2(f), from memory
    const hamView = (await rosa.get(`/api/batches/${hams}/label`)).json;
    assert.equal(
      hamView.ingredients,
      `Ingredients: Boneless ham, injected and covered (${await own(ham)}), ` +
        `Pit-house sandwich sauce (${await own(sauce)})`,
    );
    // source: 21 U.S.C. 343(w)(1)(A) and (w)(2): the mayonnaise's egg, the Worcestershire's
    // anchovy
    assert.equal(hamView.contains, 'Contains: egg, fish (anchovy)');
    // 100 g + 20 g = 120 g = 4.23 oz, rounded down. source: NIST SP 811 (2008), Appendix B.8
    assert.equal(hamView.net, 'Net wt 4.2 oz (120 g)');
    assert.equal(hamView.safeHandling.required, false);
    // Dated from its earliest part. source: FDA Food Code 2022, 3-501.17(C)
    assert.match(hamView.useBy.source, /when its earliest part was made/);
    const hamText = await pdfOf(server, `/api/batches/${hams}/label.pdf?packed=2020-12-03`);
    assert.ok(hamText.all.includes(hamView.ingredients), hamText.all);
    assert.ok(hamText.all.includes('Contains: egg, fish (anchovy)'), hamText.all);
    assert.match(hamText.all, /Net wt 4\.2 oz \(120 g\)/);
    assert.match(hamText.all, /Use by /);
    assert.doesNotMatch(hamText.all, /Safe Handling Instructions/);
    assert.ok(hamText.all.includes(`Lot ${hams}`), hamText.all);
  });
});
