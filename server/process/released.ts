import { QueryTypes, type Transaction } from 'sequelize';
import type { Database } from '../db/database.ts';
import { conflict } from '../http/app-error.ts';

/**
 * Refuses any change to the record of a batch that was verified and released (a row in
 * verifications): the reviewer's pre-shipment review (9 CFR 417.5(c)) was of this record, so
 * once released nothing is added to it or corrected in it — no reading, logger file, weighing or
 * corrective action. Read inside the caller's write, so a release committed meanwhile counts.
 * @throws AppError 409 released
 */
export async function refuseOnReleased(
  db: Database,
  t: Transaction,
  batch: { readonly id: number; readonly lotCode: string },
): Promise<void> {
  const [released] = await db.sequelize.query<{ id: number }>(
    'SELECT id FROM verifications WHERE batch_id = ? LIMIT 1',
    { replacements: [batch.id], type: QueryTypes.SELECT, transaction: t },
  );
  if (released)
    throw conflict(
      'released',
      `batch ${batch.lotCode} was verified and released: its record is closed once released, so nothing more is recorded or corrected on it`,
    );
}
