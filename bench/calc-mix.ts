// The requests of the calc-api benchmark: a kitchen's day of calculations rather than one body
// asked fifty thousand times, so that the server's kept answers (server/calc/calc-answers.ts)
// are measured at a hit rate a kitchen could see, not at 100 %.

/** A batch as the console sends it for a formula by id. */
interface CalcBody {
  formula: string;
  batch: Record<string, string>;
  units?: 'metric' | 'us';
}

const sizes = (formula: string, batches: Record<string, string>[]): CalcBody[] =>
  batches.map((batch) => ({ formula, batch }));

/**
 * The batches asked again and again (the same belly on the same scale, the week's buns): 31
 * bodies over ten demo formulas of every kind (cures, a dough, mixes, a blend, an assembly),
 * two of them in US units.
 */
export const REPEATED: readonly CalcBody[] = [
  ...sizes(
    'quillmoor-belly',
    ['3.8kg', '4.26kg', '5kg', '6.1kg'].flatMap((meat) =>
      ['4cm', '5cm'].map((thickness) => ({ meat, thickness })),
    ),
  ),
  ...sizes('hot-link-cure', [
    { meat: '5kg' },
    { meat: '10kg' },
    { meat: '12.5kg' },
    { meat: '20kg' },
  ]),
  ...sizes('ham-pump', [
    { meat: '10kg', largestPiece: '3kg' },
    { meat: '6.2kg', largestPiece: '3.1kg' },
    { meat: '8kg', largestPiece: '2.5kg' },
  ]),
  ...sizes('brisket-brine', [
    { meat: '8kg', water: '5L', thickness: '5cm' },
    { meat: '12kg', water: '7L', thickness: '6cm' },
  ]),
  ...sizes('pit-bun', [{ pieces: '24' }, { pieces: '48' }, { pieces: '96' }]),
  ...sizes('house-sauce', [{ total: '1kg' }, { total: '2kg' }, { total: '4kg' }]),
  ...sizes('brisket-rub', [{ base: '1kg' }, { base: '500g' }]),
  ...sizes('chuck-grind', [
    { total: '20kg', targetFat: '20' },
    { total: '30kg', targetFat: '15' },
  ]),
  ...sizes('bacon-pack', [{ count: '12' }, { count: '40' }]),
  { formula: 'quillmoor-belly', batch: { meat: '4.26kg', thickness: '4cm' }, units: 'us' },
  { formula: 'pit-bun', batch: { pieces: '48' }, units: 'us' },
];

/** One request in this many is a batch never asked before (a weighed piece of meat). */
export const ONE_OFF_EVERY = 4;

/**
 * The body of the nth request: every ONE_OFF_EVERY-th a belly of a weight not asked before
 * (to the gram, counted on from 2 kg), the others the repeated batches in turn.
 */
export function calcBody(n: number): string {
  if (n % ONE_OFF_EVERY === ONE_OFF_EVERY - 1)
    return JSON.stringify({
      formula: 'quillmoor-belly',
      batch: { meat: `${2000 + n} g`, thickness: '4cm' },
    });
  return JSON.stringify(REPEATED[n % REPEATED.length]);
}
