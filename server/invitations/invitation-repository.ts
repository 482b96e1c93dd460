import { createHash, randomBytes } from 'node:crypto';
import { QueryTypes, type Transaction } from 'sequelize';
import type { Database } from '../db/database.ts';
import { AppError } from '../http/app-error.ts';

/** How long an invitation link works. */
export const INVITATION_HOURS = 72;

/** What a token looks like: 32 random bytes, base64url. Anything else is not one of ours. */
export const TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;

/** Why an invitation can no longer set a password, or that it can. */
export type InvitationState = 'valid' | 'used' | 'expired' | 'replaced' | 'inactive';

/** An invitation found by its token. */
export interface FoundInvitation {
  readonly id: number;
  readonly state: InvitationState;
  readonly expiresAt: string;
  readonly person: {
    readonly id: number;
    readonly username: string;
    readonly displayName: string;
  };
}

interface InvitationRow {
  id: number;
  person_id: number;
  expires_at: string;
  used_at: string | null;
  replaced_at: string | null;
  username: string;
  display_name: string;
  active: number;
}

/** The sha-256 of a token, hex: all that is stored of it. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/**
 * Invitations to set a password. The token itself exists only in the message; the table keeps
 * its hash, when it expires, and whether it was used or replaced by a newer one.
 */
export class InvitationRepository {
  constructor(
    private readonly db: Database,
    private readonly now: () => Date,
  ) {}

  /**
   * A new invitation for a person, inside the caller's transaction; every older unused one of
   * theirs stops working.
   * @returns the token (to put in the link, never stored) and when it expires
   */
  async create(
    transaction: Transaction,
    personId: number,
    createdBy: number | null,
  ): Promise<{ token: string; expiresAt: string }> {
    const now = this.now();
    const token = randomBytes(32).toString('base64url');
    const expiresAt = new Date(now.getTime() + INVITATION_HOURS * 3_600_000).toISOString();
    await this.db.sequelize.query(
      'UPDATE invitations SET replaced_at = ? WHERE person_id = ? AND used_at IS NULL AND replaced_at IS NULL',
      { replacements: [now.toISOString(), personId], transaction },
    );
    await this.db.sequelize.query(
      `INSERT INTO invitations (person_id, token_hash, created_at, created_by, expires_at)
       VALUES (?, ?, ?, ?, ?)`,
      {
        replacements: [personId, hashToken(token), now.toISOString(), createdBy, expiresAt],
        transaction,
      },
    );
    return { token, expiresAt };
  }

  /** The invitation a token belongs to, with whether it still works; undefined when unknown. */
  async find(token: string, transaction?: Transaction): Promise<FoundInvitation | undefined> {
    if (!TOKEN_PATTERN.test(token)) return undefined;
    const [row] = await this.db.sequelize.query<InvitationRow>(
      `SELECT i.id, i.person_id, i.expires_at, i.used_at, i.replaced_at, p.username,
         p.display_name, p.active
       FROM invitations i JOIN people p ON p.id = i.person_id WHERE i.token_hash = ?`,
      { replacements: [hashToken(token)], type: QueryTypes.SELECT, transaction },
    );
    if (!row) return undefined;
    const state: InvitationState =
      row.used_at !== null
        ? 'used'
        : row.replaced_at !== null
          ? 'replaced'
          : row.active !== 1
            ? 'inactive'
            : Date.parse(row.expires_at) <= this.now().getTime()
              ? 'expired'
              : 'valid';
    return {
      id: row.id,
      state,
      expiresAt: row.expires_at,
      person: { id: row.person_id, username: row.username, displayName: row.display_name },
    };
  }

  /** Marks an invitation used, inside the caller's transaction. */
  async markUsed(transaction: Transaction, id: number): Promise<void> {
    await this.db.sequelize.query('UPDATE invitations SET used_at = ? WHERE id = ?', {
      replacements: [this.now().toISOString(), id],
      transaction,
    });
  }
}

/**
 * The invitation a token belongs to when it still works.
 * @throws AppError 404 unknown token; 410 used, expired, replaced, or the person is inactive
 */
export function usable(found: FoundInvitation | undefined): FoundInvitation {
  if (!found)
    throw new AppError(
      404,
      'invitation-unknown',
      'this invitation link is not known; check that the whole link was copied, or ask an admin to send a new invitation',
    );
  const refusals: Record<Exclude<InvitationState, 'valid'>, [string, string]> = {
    used: [
      'invitation-used',
      'this invitation link has been used already; sign in with the password you set, or ask an admin to send a new invitation',
    ],
    expired: [
      'invitation-expired',
      `this invitation link expired (links work for ${INVITATION_HOURS} hours); ask an admin to send a new invitation`,
    ],
    replaced: [
      'invitation-replaced',
      'a newer invitation was sent after this one; use the link in the newest message',
    ],
    inactive: ['invitation-inactive', 'this person can no longer sign in; ask an admin'],
  };
  if (found.state === 'valid') return found;
  const [code, message] = refusals[found.state];
  throw new AppError(410, code, message);
}
