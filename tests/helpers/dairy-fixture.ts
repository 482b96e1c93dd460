/**
 * A delivery from the invented Lowmere Dairy for the lot-use tests: thirty eggs, counted, and six
 * litres of whole milk, as the receipts table keeps them (pieces and millilitres).
 */
import { addDays } from '../../shared/calculation/dates.ts';
import type { FixtureReceipt } from './lot-use-fixture.ts';

/** The eggs' and the milk's lot codes, in the order dairyDelivery gives them. */
export const DAIRY_LOTS = { eggs: 'R-EGGS-01', milk: 'R-MILK-01' } as const;

/** 30 eggs (use by 25 days on) and 6 l of whole milk (10 days on), received on a day. */
export function dairyDelivery(receivedOn: string): FixtureReceipt[] {
  const from = { supplier: 'Lowmere Dairy', receivedOn };
  return [
    {
      ...from,
      lotCode: DAIRY_LOTS.eggs,
      item: 'eggs',
      itemName: 'eggs',
      supplierLot: 'LD-1201',
      quantity: '30',
      unit: 'each',
      amount: '30',
      useBy: addDays(receivedOn, 25),
    },
    {
      ...from,
      lotCode: DAIRY_LOTS.milk,
      item: 'whole-milk',
      itemName: 'whole milk',
      supplierLot: 'LD-1202',
      quantity: '6',
      unit: 'l',
      amount: '6000',
      useBy: addDays(receivedOn, 10),
    },
  ];
}
