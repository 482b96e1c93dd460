import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  signal,
  viewChild,
} from '@angular/core';
import {
  FormControl,
  FormGroup,
  FormGroupDirective,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormField, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { firstValueFrom } from 'rxjs';
import { Decimal } from '../../../../../shared/decimal.ts';
import type { Batch } from '../../batch-types';
import { CorrectionDialog, type Correction, type CorrectionDialogData } from '../correction-dialog';
import { ProcessStore } from '../process-store';
import type { StageName, Weighing, WeighingAnswer } from '../process-types';
import { STAGE_WORDS, clockWords, weightWords } from '../process-words';
import { weighedLines, weighingNews, weightText, type WeighedLine } from '../weighed-lines';

/**
 * Weights as weighed: each line of the sheet with its calculated amount filled in, accepted with
 * one tap (or all at once) or changed first; the ingoing nitrite worked out again on the actual
 * weights; the product weighed at each stage with its yield beside the formula's. A deviation the
 * server opens shows at once, in its words.
 */
@Component({
  selector: 'app-weights-panel',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatLabel,
    MatSuffix,
    MatInput,
    MatSelect,
    MatOption,
    MatButton,
    MatIcon,
  ],
  templateUrl: './weights-panel.html',
  styleUrl: './weights-panel.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WeightsPanel {
  private readonly dialog = inject(MatDialog);
  protected readonly store = inject(ProcessStore);

  /** The batch, with the sheet it was calculated with. */
  readonly batch = input.required<Batch>();
  /** Whether the signed-in person records weights. */
  readonly canWrite = input(false);

  private readonly fields = new Map<string, FormControl<string>>();
  protected readonly stageWords = STAGE_WORDS;
  protected readonly stages = Object.keys(STAGE_WORDS) as StageName[];
  protected readonly stage = new FormControl<StageName>('green', { nonNullable: true });
  protected readonly stageWeight = new FormControl('', {
    nonNullable: true,
    validators: [Validators.required, Validators.pattern(/\S/)],
  });
  /** The stage form's group: it makes the form Angular's, so a submit never reloads the page. */
  protected readonly stageForm = new FormGroup({ stage: this.stage, weight: this.stageWeight });
  /** Its directive: resetting it also forgets the submit, so the empty box is not shown in error. */
  private readonly stageFormDirective = viewChild(FormGroupDirective);
  protected readonly answer = signal<WeighingAnswer | null>(null);
  protected readonly problem = signal<string | null>(null);

  protected readonly lines = computed(() =>
    weighedLines(this.batch().result, this.store.record()?.weighings ?? []),
  );
  protected readonly waiting = computed(() => this.lines().filter((l) => !l.weighed));
  /** Each stage weighed, in the order of the work, with its yield beside the formula's. */
  protected readonly stageRows = computed(() => {
    const record = this.store.record();
    return this.stages.flatMap((name) => {
      const weighing = record?.weighings
        .filter((w) => w.kind === 'stage' && w.name === name && w.correctedBy === null)
        .at(-1);
      if (!weighing) return [];
      const found = record?.actualYields.find((y) => y.stage === name) ?? null;
      return [{ weighing, words: STAGE_WORDS[name], yield: found }];
    });
  });
  protected readonly actualPpm = computed(() => {
    const ppm = this.store.record()?.actualNitritePpm ?? this.answer()?.actualNitritePpm;
    return ppm ? new Decimal(ppm).toFixed(1) : null;
  });
  protected readonly calculatedPpm = computed(() => {
    const ppm = this.batch().nitritePpm;
    return ppm ? new Decimal(ppm).toFixed(1) : null;
  });

  /** The box of a line, filled with the calculated amount until changed. */
  protected field(line: WeighedLine): FormControl<string> {
    let field = this.fields.get(line.name);
    if (!field) {
      field = new FormControl(line.amount, { nonNullable: true });
      this.fields.set(line.name, field);
    }
    return field;
  }

  protected news(messages: readonly string[]): string[] {
    return weighingNews(messages);
  }

  protected weight(grams: string): string {
    return weightWords(grams);
  }

  protected when(iso: string): string {
    return clockWords(iso);
  }

  protected percent(value: string | null): string {
    return value === null ? '—' : `${new Decimal(value).toFixed(1)} %`;
  }

  /** Records the lines given (one, or every line not yet weighed) as their boxes say. */
  protected async accept(lines: readonly WeighedLine[]): Promise<void> {
    const body = lines
      .map((line) => ({ name: line.name, weight: weightText(this.field(line).value, line.amount) }))
      .filter((line) => line.weight !== '');
    if (body.length === 0) return;
    this.settle(await this.store.weigh({ lines: body }));
  }

  protected async recordStage(): Promise<void> {
    if (this.stageWeight.invalid) {
      this.stageWeight.markAsTouched();
      return;
    }
    const weight = weightText(this.stageWeight.value, 'kg');
    const outcome = await this.store.weigh({ stage: { name: this.stage.value, weight } });
    if (outcome.ok) this.stageFormDirective()?.resetForm({ stage: this.stage.value, weight: '' });
    this.settle(outcome);
  }

  protected async correct(weighing: Weighing, amount: string): Promise<void> {
    const dialog = this.dialog.open<CorrectionDialog, CorrectionDialogData, Correction>(
      CorrectionDialog,
      {
        data: {
          what: weighing.kind === 'stage' ? STAGE_WORDS[weighing.name as StageName] : weighing.name,
          old: weightWords(weighing.grams),
          unit: /([a-z]+)\s*$/i.exec(amount)?.[1] ?? 'g',
        },
        width: '520px',
        maxWidth: '95vw',
      },
    );
    const answer = await firstValueFrom(dialog.afterClosed());
    if (!answer) return;
    this.settle(
      await this.store.correctWeighing(
        weighing.id,
        weightText(answer.value, amount),
        answer.reason,
      ),
    );
  }

  private settle(outcome: Awaited<ReturnType<ProcessStore['weigh']>>): void {
    this.answer.set(outcome.ok ? outcome.value : null);
    this.problem.set(outcome.ok ? null : outcome.message);
  }
}
