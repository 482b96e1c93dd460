import { ChangeDetectionStrategy, Component, inject, output, signal } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { messageOf } from '../../core/api/message-of';
import type { FormulaProblem } from '../formula-api-types';
import { FormulaProblems } from '../formula-problems/formula-problems';
import { problemsOf } from '../formula-problems/problems-of';
import { FormulaStore } from '../formula-store';

/**
 * Uploads a formula file (.yaml or .yml) as a new formula. A refused file is explained with its
 * problems, each with its line and column.
 */
@Component({
  selector: 'app-formula-upload',
  imports: [MatIcon, MatProgressBar, FormulaProblems],
  templateUrl: './formula-upload.html',
  styleUrl: './formula-upload.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FormulaUpload {
  private readonly store = inject(FormulaStore);
  private readonly snackBar = inject(MatSnackBar);

  /** Emits the id of a formula uploaded. */
  readonly uploaded = output<string>();

  protected readonly busy = signal(false);
  protected readonly fileName = signal<string | null>(null);
  protected readonly failure = signal<string | null>(null);
  protected readonly problems = signal<FormulaProblem[]>([]);

  protected async upload(event: Event): Promise<void> {
    const field = event.target as HTMLInputElement;
    const file = field.files?.item(0);
    // Let the same file be chosen again after fixing it.
    field.value = '';
    if (!file || this.busy()) return;
    this.busy.set(true);
    this.fileName.set(file.name);
    this.failure.set(null);
    this.problems.set([]);
    try {
      const outcome = await this.store.upload(file, `Upload ${file.name}`);
      this.snackBar.open(`Uploaded ${file.name} as “${outcome.id}”`, 'Close', { duration: 6000 });
      this.uploaded.emit(outcome.id);
    } catch (error) {
      this.failure.set(messageOf(error));
      this.problems.set(problemsOf(error));
    } finally {
      this.busy.set(false);
    }
  }

  protected dismiss(): void {
    this.failure.set(null);
    this.problems.set([]);
  }
}
