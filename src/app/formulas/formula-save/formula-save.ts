import {
  ChangeDetectionStrategy,
  Component,
  inject,
  output,
  signal,
  viewChild,
} from '@angular/core';
import {
  FormGroupDirective,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { messageOf } from '../../core/api/message-of';
import { FormulaDiff, FormulaProblem, WriteOutcome } from '../formula-api-types';
import { FormulaDraft } from '../formula-draft';
import { FormulaProblems } from '../formula-problems/formula-problems';
import { FormulaStore } from '../formula-store';
import { RevisionDiff } from '../revision-diff/revision-diff';

/** Where the last save attempt left things. */
type SaveState =
  | { readonly kind: 'none' }
  | { readonly kind: 'saved'; readonly outcome: WriteOutcome }
  | { readonly kind: 'conflict'; readonly loadedRevision: string }
  | { readonly kind: 'invalid'; readonly message: string; readonly problems: FormulaProblem[] }
  | { readonly kind: 'failed'; readonly message: string };

/**
 * Saving the draft (admins): a required message for the history, then a save that names the
 * revision it was made on. A conflict (someone else saved, or the file changed on disk) is said
 * plainly, with their version to reload and the difference to look at.
 */
@Component({
  selector: 'app-formula-save',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatLabel,
    MatHint,
    MatError,
    MatInput,
    MatButton,
    MatIcon,
    MatProgressBar,
    FormulaProblems,
    RevisionDiff,
  ],
  templateUrl: './formula-save.html',
  styleUrl: './formula-save.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FormulaSave {
  private readonly store = inject(FormulaStore);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly draft = inject(FormulaDraft);

  /** Emits a problem of a refused save that was chosen, to show it in the YAML. */
  readonly problemChosen = output<FormulaProblem>();

  private readonly formDirective = viewChild.required(FormGroupDirective);
  protected readonly form = inject(NonNullableFormBuilder).group({
    message: ['', [Validators.required, Validators.pattern(/\S/), Validators.maxLength(1000)]],
  });
  protected readonly busy = signal(false);
  protected readonly state = signal<SaveState>({ kind: 'none' });
  protected readonly conflictDiff = signal<FormulaDiff | null>(null);
  protected readonly diffError = signal<string | null>(null);

  protected async save(): Promise<void> {
    if (this.busy()) return;
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.conflictDiff.set(null);
    this.diffError.set(null);
    try {
      const result = await this.draft.save(this.form.getRawValue().message.trim());
      this.state.set(result);
      if (result.kind === 'saved') {
        // resetForm also forgets the submit, so the empty message shows no error.
        this.formDirective().resetForm();
        const { outcome } = result;
        this.snackBar.open(
          outcome.changed
            ? 'Saved: new batches are worked out from this version'
            : 'Nothing to save: the file already says this',
          'Close',
          { duration: 6000 },
        );
      }
    } finally {
      this.busy.set(false);
    }
  }

  protected async reloadTheirs(): Promise<void> {
    await this.draft.reload();
    this.state.set({ kind: 'none' });
    this.conflictDiff.set(null);
  }

  protected async showDifference(loadedRevision: string): Promise<void> {
    const id = this.draft.detail()?.id;
    if (!id) return;
    this.diffError.set(null);
    try {
      this.conflictDiff.set(await this.store.diff(id, loadedRevision));
    } catch (error) {
      this.diffError.set(messageOf(error));
    }
  }
}
