import { computed, type Signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import type { AbstractControl } from '@angular/forms';
import { scan, switchMap } from 'rxjs';

/**
 * A signal of something read off a form control (given as a signal, such as an input), read again
 * whenever the control's value changes. Templates of OnPush components in a zoneless app need
 * this to follow values set by code, such as a form filled from YAML. Call in an injection context.
 * @param control the control, as a signal
 * @param read what to read off it
 */
export function watchControl<C extends AbstractControl, R>(
  control: Signal<C>,
  read: (control: C) => R,
): Signal<R> {
  const changes = toSignal(
    toObservable(control).pipe(
      switchMap((current) => current.valueChanges),
      scan((count) => count + 1, 0),
    ),
    { initialValue: 0 },
  );
  return computed(() => {
    changes();
    return read(control());
  });
}
