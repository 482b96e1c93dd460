import type { MatDialog } from '@angular/material/dialog';
import { firstValueFrom } from 'rxjs';
import type { ActionRequest } from '../batches/process/process-store';
import { messageOf } from '../core/api/message-of';
import type { EquipmentStore } from './equipment-store';

/** What happened to a corrective action asked for: recorded, cancelled, or refused in words. */
export type ActionOutcome = { readonly recorded: boolean; readonly failure: string | null };

/**
 * Asks for the corrective action of an equipment deviation in the batch page's dialog (the four
 * things of 9 CFR 417.3(a)), and records it through the same route as a batch's.
 */
export async function recordEquipmentAction(
  dialog: MatDialog,
  store: EquipmentStore,
  deviation: { readonly id: number; readonly what: string },
): Promise<ActionOutcome> {
  const { CorrectiveActionDialog } = await import('../batches/process/corrective-action-dialog');
  const ref = dialog.open(CorrectiveActionDialog, {
    data: { what: deviation.what, suggestion: null, replacing: false },
    width: '640px',
    maxWidth: '96vw',
  });
  const action = (await firstValueFrom(ref.afterClosed())) as ActionRequest | undefined;
  if (!action) return { recorded: false, failure: null };
  try {
    await store.act(deviation.id, action);
    return { recorded: true, failure: null };
  } catch (error) {
    return { recorded: false, failure: messageOf(error) };
  }
}
