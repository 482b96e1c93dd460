import { BreakpointObserver } from '@angular/cdk/layout';
import { inject, type Signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { map } from 'rxjs';

/** A phone held upright: lists fold their columns into one. */
export const PHONE_WIDTH = '(max-width: 599.98px)';

/**
 * Whether the window matches a media query, kept up to date as it is resized or turned. Call it
 * where `inject` works (a field initialiser of a component).
 */
export function mediaMatch(query: string): Signal<boolean> {
  return toSignal(
    inject(BreakpointObserver)
      .observe(query)
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
}
