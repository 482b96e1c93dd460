import { QueryTypes, type Transaction } from 'sequelize';
import type { Database } from '../db/database.ts';

/**
 * The site a message about a record is for: its people get it (reminder-prefs-repository.ts), and
 * it names the site (`name`) when the install has several; null on a single-site install, whose
 * messages read as before sites.
 */
export interface MessageSite {
  readonly id: number;
  readonly name: string | null;
}

/** The site of a batch, else of a piece of equipment, else the first; and whether there are several. */
const SITE_SQL = `SELECT s.id, s.name, (SELECT COUNT(*) FROM sites) AS sites FROM sites s
  WHERE s.id = COALESCE((SELECT site_id FROM batches WHERE id = ?),
    (SELECT site_id FROM equipment WHERE id = ?), 1)`;

/**
 * The site a message about a batch or a piece of equipment is for, read in the caller's
 * transaction (the decision to send is made there).
 */
export async function messageSite(
  db: Database,
  t: Transaction,
  about: { readonly batchId?: number | null; readonly equipmentId?: number | null },
): Promise<MessageSite> {
  const [row] = await db.sequelize.query<{ id: number; name: string; sites: number | string }>(
    SITE_SQL,
    {
      replacements: [about.batchId ?? null, about.equipmentId ?? null],
      type: QueryTypes.SELECT,
      transaction: t,
    },
  );
  if (!row) return { id: 1, name: null };
  return { id: Number(row.id), name: Number(row.sites) > 1 ? row.name : null };
}

/**
 * The kitchen as a message's footer names it: with the site when the install has several (not
 * twice when the site bears the kitchen's name, as the first one does).
 */
export function kitchenAt(kitchen: string, site: MessageSite): string {
  return site.name === null || site.name === kitchen ? kitchen : `${kitchen}, ${site.name}`;
}

/** A message's subject, led by the site's name when the install has several. */
export function subjectAt(subject: string, site: MessageSite | undefined): string {
  return site?.name ? `${site.name}: ${subject}` : subject;
}
