import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { ProcessStore } from '../process-store';
import { clockWords } from '../process-words';

/**
 * Verification and release: a reviewer's pre-shipment review of the batch's process record
 * (9 CFR 417.5(c)), which releases it. The button says what is verified; a refusal (on hold, a
 * control still open, not finished, one's own batch) is shown in the server's words. A released
 * batch shows who released it and when. The sign-off of the batch sheet stays apart.
 */
@Component({
  selector: 'app-release-panel',
  imports: [ReactiveFormsModule, MatButton, MatIcon, MatFormField, MatLabel, MatInput],
  template: `
    @if (store.record()?.verification; as verified) {
      <p class="released" data-testid="released">
        <mat-icon aria-hidden="true">verified</mat-icon>
        <span>
          <strong>Released</strong>: records verified by
          {{ verified.by?.displayName ?? 'someone no longer listed' }},
          {{ when(verified.recordedAt) }}
          @if (verified.note) {
            <span class="note">“{{ verified.note }}”</span>
          }
          <span class="note">
            The record is closed once released: nothing more is recorded or corrected on it.
          </span>
        </span>
      </p>
    } @else if (canVerify()) {
      <form class="verify" [formGroup]="form" (ngSubmit)="verify()" data-testid="verify-form">
        <p class="lead">
          Verifying releases the batch. You confirm you have reviewed its process record: every
          control’s readings against its critical limit, the weights as weighed, and the corrective
          action of each deviation.
        </p>
        <mat-form-field class="note-box" subscriptSizing="dynamic">
          <mat-label>Note (optional)</mat-label>
          <input matInput [formControl]="note" maxlength="500" data-testid="verify-note" />
        </mat-form-field>
        <button
          matButton="filled"
          type="submit"
          [disabled]="store.writing()"
          data-testid="verify-button"
        >
          <mat-icon>verified</mat-icon> Verify the records and release
        </button>
      </form>
      @if (refused(); as message) {
        <p class="refused" role="alert" data-testid="verify-refused">{{ message }}</p>
      }
    } @else {
      <p class="waiting" data-testid="not-released">
        Not released yet: a reviewer verifies the records and releases the batch.
      </p>
    }
  `,
  styles: `
    .released {
      display: flex;
      align-items: center;
      gap: 8px;
      margin: 0;
      padding: 12px 16px;
      border-radius: 12px;
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
      font: var(--mat-sys-body-large);
    }
    mat-icon {
      flex: none;
    }
    .note {
      display: block;
      font: var(--mat-sys-body-small);
    }
    .verify {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 12px;
    }
    .lead {
      flex: 1 1 100%;
      margin: 0;
    }
    .note-box {
      flex: 1 1 240px;
    }
    button {
      min-height: 48px;
    }
    .refused {
      margin: 8px 0 0;
      padding: 12px 16px;
      border-radius: 8px;
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
    .waiting {
      margin: 0;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReleasePanel {
  protected readonly store = inject(ProcessStore);

  /** Whether the signed-in person verifies (admins and reviewers). */
  readonly canVerify = input(false);
  /** Emitted once the batch is released. */
  readonly released = output<void>();

  protected readonly note = new FormControl('', {
    nonNullable: true,
    validators: Validators.maxLength(500),
  });
  /** The form's group: it makes the form Angular's, so a submit never reloads the page. */
  protected readonly form = new FormGroup({ note: this.note });
  protected readonly refused = signal<string | null>(null);

  protected when(iso: string): string {
    return clockWords(iso);
  }

  protected async verify(): Promise<void> {
    const outcome = await this.store.verify(this.note.value.trim() || undefined);
    this.refused.set(outcome.ok ? null : `Not released. ${outcome.message}`);
    if (outcome.ok) this.released.emit();
  }
}
