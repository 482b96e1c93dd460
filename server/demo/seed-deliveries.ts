import type { ReceiptRequest } from '../../shared/api/receipt.ts';
import { addDays } from '../../shared/calculation/dates.ts';
import { linkLines } from '../../shared/catalogue/link-catalogue.ts';
import type { CatalogueItem } from '../../shared/catalogue/catalogue-types.ts';
import type { AppContext } from '../app-context.ts';
import type { BatchActor } from '../batches/batch.ts';
import { AppError } from '../http/app-error.ts';
import { CatalogueItems } from '../stock/catalogue-items.ts';

/** An invented supplier of the invented kitchen: no real business. */
interface DemoSupplier {
  readonly name: string;
  /** The establishment number of its (invented) inspected plant, for meat. */
  readonly establishment?: string;
  /** Its lot codes: a prefix and a number that grows with the day. */
  readonly lotPrefix: string;
}

const PORK: DemoSupplier = {
  name: 'Fenwick Hollow Pork',
  establishment: 'EST. 38214',
  lotPrefix: 'FH',
};
const BEEF: DemoSupplier = {
  name: 'Marrowby Beef Co-op',
  establishment: 'EST. 51907',
  lotPrefix: 'MB',
};
const DRY: DemoSupplier = { name: 'Tallis & Crane Provisions', lotPrefix: 'TC' };
const DAIRY: DemoSupplier = { name: 'Lowmere Dairy', lotPrefix: 'LD' };

/** The meat each cure is made from: its base weight, not a line of the formula. */
const CURED_MEAT: Readonly<Record<string, readonly string[]>> = {
  'quillmoor-belly': ['pork-belly'],
  'maple-pump-belly': ['pork-belly'],
  'ham-pump': ['pork-leg'],
  'hot-link-cure': ['pork-shoulder', 'beef-chuck-trim'],
  'brisket-brine': ['beef-brisket'],
};

/**
 * How often an item comes (days), how much and in which unit (the pork plant sells by the pound):
 * about what the demo batches use between deliveries (bellies for two bacon batches a week, trim
 * for a weekly grind and the hot links).
 */
const SCHEDULE: Readonly<Record<string, readonly [number, string, ReceiptRequest['unit']]>> = {
  'pork-belly': [7, '24', 'lb'],
  'pork-leg': [14, '7', 'kg'],
  'pork-shoulder': [7, '9', 'kg'],
  'beef-brisket': [14, '9', 'kg'],
  'beef-chuck-trim': [7, '20', 'kg'],
  'beef-fat-trim': [7, '6', 'kg'],
  'kosher-salt': [21, '25', 'kg'],
  'sea-salt': [21, '10', 'kg'],
  'bread-flour': [21, '25', 'kg'],
  'whole-milk': [7, '6', 'l'],
  'butter-unsalted': [21, '2', 'kg'],
  eggs: [7, '90', 'each'],
};

/** Price per unit received, in the kitchen's money (invented). */
const PRICE: Readonly<Record<string, string>> = {
  'pork-belly': '2.95',
  'pork-leg': '5.40',
  'pork-shoulder': '4.80',
  'beef-brisket': '11.20',
  'beef-chuck-trim': '7.90',
  'beef-fat-trim': '2.10',
};

/** Who sells an item: pork and beef from their plants, dairy and eggs from the dairy. */
function supplierOf(item: CatalogueItem): DemoSupplier {
  if (item.kind === 'meat') return item.key.startsWith('pork') ? PORK : BEEF;
  if ((item.kind === 'dairy' || item.kind === 'egg') && !item.shelf_stable) return DAIRY;
  return DRY;
}

/** Its schedule: as set out above, else fresh goods weekly and the rest every three weeks. */
function scheduleOf(item: CatalogueItem): readonly [number, string, ReceiptRequest['unit']] {
  const fresh =
    item.kind === 'meat' || item.kind === 'egg' || (item.kind === 'dairy' && !item.shelf_stable);
  return SCHEDULE[item.key] ?? [fresh ? 7 : 21, '5', item.unit];
}

/** Days from the pack day to the use-by: vacuum-packed fresh meat two weeks, and so on. */
function shelfDays(item: CatalogueItem): number | null {
  // Common practice, no source: the invented suppliers' own dating.
  if (item.kind === 'meat') return 16;
  if (item.kind === 'dairy' && !item.shelf_stable) return item.key === 'butter-unsalted' ? 60 : 12;
  if (item.kind === 'egg') return 30;
  if (item.kind === 'yeast') return 120;
  if (item.kind === 'sauce') return 180;
  if (item.kind === 'flour') return 240;
  return null;
}

/** Readings at the door, varied without randomness. */
const CHILLED = ['2.4 °C', '1.8 °C', '3.1 °C', '36 °F', '2.9 °C', '3.6 °C'];

/** The catalogue items the demo formulas use, by key, and the meat their cures are made from. */
async function itemsUsed(context: AppContext, catalogue: CatalogueItems): Promise<CatalogueItem[]> {
  const items = await catalogue.items();
  const all = [...items.values()];
  const keys = new Set<string>();
  let files;
  try {
    files = await context.formulas.files();
  } catch (error) {
    if (error instanceof AppError) return [];
    throw error;
  }
  for (const file of files) {
    const formula = file.reading.formula;
    if (!formula) continue;
    for (const key of CURED_MEAT[formula.id] ?? []) keys.add(key);
    for (const { index } of linkLines(formula, { catalogue: 1, items: all }))
      if (index !== undefined) keys.add(all[index].key);
  }
  // Tap water is not delivered.
  return [...keys]
    .map((key) => items.get(key))
    .filter((item): item is CatalogueItem => item !== undefined && item.kind !== 'water')
    .sort((a, b) => a.key.localeCompare(b.key));
}

/** One delivery to make: the day (from today), the minutes after midnight UTC, the request. */
interface DemoDelivery {
  readonly day: number;
  readonly minutes: number;
  readonly request: ReceiptRequest;
  readonly by: 'tobin' | 'rosa';
}

function delivery(item: CatalogueItem, day: number, today: string, n: number): DemoDelivery {
  const supplier = supplierOf(item);
  const [, quantity, unit] = scheduleOf(item);
  const receivedOn = addDays(today, day);
  const packed = addDays(receivedOn, item.kind === 'meat' ? -2 : -5);
  const shelf = shelfDays(item);
  const chilled = item.kind === 'meat' || (item.kind === 'dairy' && !item.shelf_stable);
  return {
    day,
    minutes: 6 * 60 + 20 + (n % 6) * 11,
    by: n % 4 === 3 ? 'rosa' : 'tobin',
    request: {
      item: item.key,
      supplier: supplier.name,
      supplierLot: `${supplier.lotPrefix}-${receivedOn.slice(2).replaceAll('-', '')}-${String((n % 9) + 1)}`,
      ...(supplier.establishment && item.kind === 'meat'
        ? { establishment: supplier.establishment }
        : {}),
      ...(shelf === null ? {} : { packedOn: packed, useBy: addDays(packed, shelf) }),
      quantity,
      unit,
      ...(PRICE[item.key] ? { unitCost: PRICE[item.key] } : {}),
      ...(chilled ? { temperature: CHILLED[n % CHILLED.length] } : {}),
      // source: FDA Food Code 2022, §3-202.11(C): shell eggs in air at 45 °F or below
      ...(item.kind === 'egg' ? { temperature: '42 °F' } : {}),
    },
  };
}

/** Six weeks of deliveries up to yesterday, and one refused at the door for its temperature. */
function demoDeliveries(items: readonly CatalogueItem[], today: string): DemoDelivery[] {
  const deliveries: DemoDelivery[] = [];
  for (const item of items) {
    const [every] = scheduleOf(item);
    // Staggered by item so the door is not one morning's rush.
    for (let day = -42 + (deliveries.length % 3); day <= -1; day += every)
      deliveries.push(delivery(item, day, today, deliveries.length));
  }
  const belly = items.find((item) => item.key === 'pork-belly');
  if (belly) {
    const refused = delivery(belly, -23, today, 4);
    deliveries.push({
      ...refused,
      minutes: 6 * 60 + 5,
      request: {
        ...refused.request,
        supplierLot: `FH-${addDays(today, -23).slice(2).replaceAll('-', '')}-R`,
        // source: FDA Food Code 2022, §3-202.11(A): 41 °F or below; 8.5 °C is over it
        temperature: '8.5 °C',
        decision: 'refuse',
        note: 'Refused at the door: the bellies read 8.5 °C and the van’s cooling unit had failed on the round. Fenwick Hollow sent a fresh load the next morning.',
      },
    });
  }
  return deliveries.sort((a, b) => a.day - b.day || a.minutes - b.minutes);
}

/**
 * Receives about six weeks of the invented kitchen's deliveries, from four invented suppliers,
 * for every catalogue item the demo formulas use, through the same receiving path as the API
 * (limits judged, lot codes given), dated so the demo batches could have drawn on them; one
 * pork-belly delivery is refused for its temperature. History: no audit entries. Returns how
 * many were recorded.
 */
export async function seedDeliveries(context: AppContext, now = new Date()): Promise<number> {
  const today = now.toISOString().slice(0, 10);
  const people = new Map<string, BatchActor>();
  for (const name of ['tobin', 'rosa']) {
    const person = await context.people.findByUsername(name);
    if (!person) return 0;
    people.set(name, person);
  }
  const catalogue = new CatalogueItems(context.formulas.folder);
  const plan = demoDeliveries(await itemsUsed(context, catalogue), today);
  await context.records.receiveAll(
    plan.map(({ day, minutes, request, by }) => ({
      request,
      by: {
        actor: people.get(by)!,
        at: new Date(
          Date.parse(`${addDays(today, day)}T00:00:00Z`) + minutes * 60_000,
        ).toISOString(),
        audit: false,
      },
    })),
  );
  return plan.length;
}
