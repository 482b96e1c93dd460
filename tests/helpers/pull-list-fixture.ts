import { QueryTypes, type Sequelize } from 'sequelize';

/** A database to write to: a test server's (`server.context.db`) or one opened on a file. */
export interface StockDatabase {
  readonly sequelize: Sequelize;
}

/**
 * A delivery as the receipts table keeps it; amounts in the item's base measure: grams, unless
 * `unit` says the item is counted (each) or measured (ml).
 */
export interface ReceiptToAdd {
  readonly item: string;
  readonly itemName: string;
  readonly supplier: string;
  readonly supplierLot: string;
  /** Grams (or pieces, or millilitres) received; what is left too unless `remaining` says otherwise. */
  readonly grams: string;
  /** The base measure received in: 'g' unless given. */
  readonly unit?: 'g' | 'ml' | 'each';
  readonly remaining?: string;
  readonly useBy?: string;
  /** When it was taken in, ISO 8601 with its offset. */
  readonly receivedAt: string;
  readonly decision?: 'accepted' | 'accepted-with-action' | 'refused';
  readonly emptiedOn?: string;
}

/**
 * Empties the test server's stock: no lot uses, no receipts (deviations opened at the door lose
 * their link), so a test starts from a kitchen that has received nothing, whatever demo
 * deliveries the server was started with.
 */
export async function clearStock({ sequelize }: StockDatabase): Promise<void> {
  await sequelize.query('DELETE FROM lot_uses');
  await sequelize.query('UPDATE deviations SET receipt_id = NULL WHERE receipt_id IS NOT NULL');
  await sequelize.query('DELETE FROM receipts');
}

/**
 * Writes deliveries straight into the receipts table with plain SQL, as receiving will keep them
 * (migration 015): the kitchen's lot code R + the receiving day YYMMDD + "-" + the day's
 * sequence from 01, received by the first person on the records.
 * @returns the lot codes, in the order given
 */
export async function addReceipts(
  { sequelize }: StockDatabase,
  receipts: readonly ReceiptToAdd[],
): Promise<string[]> {
  const [person] = await sequelize.query<{ id: number }>(
    'SELECT id FROM people ORDER BY id LIMIT 1',
    { type: QueryTypes.SELECT },
  );
  const codes: string[] = [];
  for (const r of receipts) {
    const day = r.receivedAt.slice(0, 10);
    const [{ n }] = await sequelize.query<{ n: number }>(
      'SELECT COUNT(*) AS n FROM receipts WHERE received_on = ?',
      { replacements: [day], type: QueryTypes.SELECT },
    );
    const code = `R${day.slice(2).replace(/-/g, '')}-${String(n + 1).padStart(2, '0')}`;
    await sequelize.query(
      `INSERT INTO receipts (lot_code, item, item_name, supplier, supplier_lot, use_by, quantity,
         unit, amount, remaining, decision, received_at, received_on, person_id, emptied_on)
       VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
      {
        replacements: [
          code,
          r.item,
          r.itemName,
          r.supplier,
          r.supplierLot,
          r.useBy ?? null,
          r.grams,
          r.unit ?? 'g',
          r.grams,
          r.remaining ?? r.grams,
          r.decision ?? 'accepted',
          r.receivedAt,
          day,
          person.id,
          r.emptiedOn ?? null,
        ],
        type: QueryTypes.INSERT,
      },
    );
    codes.push(code);
  }
  return codes;
}

/**
 * Deliveries received `today` (YYYY-MM-DD) against 120 burgers served on `service`, invented
 * for the tests: 5 000 g of sea salt to use by five days before service (good for the belly's
 * day, past it by the bun's), 10 kg of honey, and 5 g of curing salt, less than the belly needs.
 */
export function burgerReceipts(today: string, service: string): ReceiptToAdd[] {
  const at = (time: string) => `${today}T${time}:00Z`;
  const [y, m, d] = service.split('-').map(Number);
  const useBy = new Date(Date.UTC(y, m - 1, d - 5)).toISOString().slice(0, 10);
  return [
    {
      item: 'sea-salt',
      itemName: 'sea salt',
      supplier: 'Harrowgate Dry Goods',
      supplierLot: 'HG-2231',
      grams: '5000',
      useBy,
      receivedAt: at('06:00'),
    },
    {
      item: 'honey',
      itemName: 'honey',
      supplier: 'Ashby Apiary',
      supplierLot: 'AA-7',
      grams: '10000',
      receivedAt: at('06:20'),
    },
    {
      item: 'curing-salt-1',
      itemName: 'curing salt',
      supplier: 'Kestrel Cure Supply',
      supplierLot: 'KC-31',
      grams: '5',
      receivedAt: at('06:30'),
    },
  ];
}
