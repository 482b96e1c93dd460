import type { CanDeactivateFn } from '@angular/router';

/** A page that may hold changes not yet saved. */
export interface LeavesSafely {
  /** Whether the page may be left: true when nothing would be lost, or the person agrees. */
  canLeave(): boolean;
}

/** Asks before leaving a page with unsaved changes. */
export const unsavedChangesGuard: CanDeactivateFn<LeavesSafely> = (page) => page.canLeave();
