import type { Transaction } from 'sequelize';
import type { AuditAction } from '../../shared/api/audit-event.ts';
import type { ChangeOptions } from '../batches/batch.ts';
import type { AuditRepository } from './audit-repository.ts';

/**
 * Appends the audit entry of a change inside the caller's write: who made it, from where, what
 * and to what. Nothing when the change is demo history (`options.audit` false), which the log
 * would otherwise show as made by the demo's people at the moment it was seeded.
 */
export async function appendChange(
  audit: AuditRepository,
  t: Transaction,
  options: ChangeOptions,
  action: AuditAction,
  subject: string,
  detail: object,
): Promise<void> {
  if (options.audit === false) return;
  await audit.append(
    {
      actor: options.actor,
      action,
      subject,
      detail,
      ...(options.ip === undefined ? {} : { ip: options.ip }),
    },
    t,
  );
}
