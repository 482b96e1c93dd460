import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatAnchor } from '@angular/material/button';
import { MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect, MatSelectTrigger } from '@angular/material/select';
import { catchError, combineLatest, debounceTime, map, of, startWith, switchMap } from 'rxjs';
import type { LabelNotYet, ProductLabelView } from '../../../../shared/api/product-label-view.ts';
import type { ShiPicture } from '../../../../shared/labels/safe-handling-text.ts';
import { messageOf } from '../../core/api/message-of';
import { DAY_INPUT_IMPORTS, provideDayInputs } from '../../ui/batch-sheet/day-input-formats';
import { IsoDayPipe, isoDateOf } from '../../ui/batch-sheet/iso-day-pipe';
import {
  LABEL_SIZE_CHOICES,
  labelContentUrl,
  labelPdfUrl,
  labelProblem,
  refusedSizes,
  type LabelAsk,
  type LabelSizeChoice,
} from './label-request';

/** The preview as read: the label's content, or why it could not be worked out. */
type Preview = { readonly view: ProductLabelView } | { readonly error: string };

/** The Material Symbols standing for the pictures the printed label draws of its own. */
const PICTURE_ICONS: Readonly<Record<ShiPicture, string>> = {
  refrigerator: 'kitchen',
  hands: 'wash',
  skillet: 'skillet',
  thermometer: 'thermometer',
};

/**
 * A batch's product label: its content as it will print, worked out by the API from the batch's
 * formula and recorded weights, with a size, the package's net weight and the packed-on day to
 * choose, and "Print label" opening the PDF. The caution that label approval is the kitchen's to
 * follow stands above it.
 */
@Component({
  selector: 'app-label-preview',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatLabel,
    MatHint,
    MatSuffix,
    MatInput,
    DAY_INPUT_IMPORTS,
    MatSelect,
    MatSelectTrigger,
    MatOption,
    MatAnchor,
    MatIcon,
    IsoDayPipe,
  ],
  providers: [provideDayInputs()],
  templateUrl: './label-preview.html',
  styleUrl: './label-preview.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LabelPreview {
  private readonly http = inject(HttpClient);

  /** The batch's lot code. */
  readonly lot = input.required<string>();
  /** Changes when the batch's lots are recorded: an assembly's label is made of its parts. */
  readonly lotsRecorded = input(0);

  protected readonly sizes = LABEL_SIZE_CHOICES;
  protected readonly icons = PICTURE_ICONS;
  protected readonly form = new FormGroup({
    size: new FormControl<LabelSizeChoice>('4x6', { nonNullable: true }),
    net: new FormControl('', { nonNullable: true }),
    packed: new FormControl<Date | null>(null),
  });
  private readonly ask = toSignal(this.form.valueChanges.pipe(map(() => this.asked())), {
    initialValue: this.asked(),
  });

  protected readonly small = computed(() => this.ask().size !== '4x6');
  /** The chosen size in words, without the option's note of why it is unavailable. */
  protected readonly chosenWords = computed(
    () => this.sizes.find((choice) => choice.size === this.ask().size)?.words ?? '',
  );
  /** What the chosen size prints, in a cook's words. */
  protected readonly chosenAbout = computed(
    () => this.sizes.find((choice) => choice.size === this.ask().size)?.about ?? '',
  );
  protected readonly pdfUrl = computed(() => labelPdfUrl(this.lot(), this.ask()));

  /** The content, asked for again a moment after the net weight or the day changes. */
  protected readonly preview = toSignal(
    combineLatest([
      toObservable(this.lot),
      toObservable(this.lotsRecorded),
      this.form.valueChanges.pipe(
        startWith(null),
        map(() => this.asked()),
        debounceTime(300),
      ),
    ]).pipe(
      switchMap(([lot, , ask]) =>
        this.http.get<ProductLabelView | LabelNotYet>(labelContentUrl(lot, ask)).pipe(
          map((view): Preview => ('notYet' in view ? { error: view.notYet } : { view })),
          catchError((error: unknown) => of<Preview>({ error: messageOf(error) })),
        ),
      ),
    ),
  );

  protected readonly view = computed(() => {
    const preview = this.preview();
    return preview && 'view' in preview ? preview.view : undefined;
  });
  protected readonly error = computed(() => {
    const preview = this.preview();
    return preview && 'error' in preview ? preview.error : undefined;
  });

  /** The sizes this product cannot go on, with why, as the label's content says. */
  protected readonly refused = computed(() => refusedSizes(this.view()?.sizes));
  /** Why the small sizes are refused, for the notes under the label: they print one sticker. */
  protected readonly smallRefused = computed(() => this.refused().get('2x1'));
  protected readonly problem = computed(() => labelProblem(this.ask(), this.view()));

  /** What the form asks for, the packed-on day as YYYY-MM-DD ('' for today). */
  private asked(): LabelAsk {
    const { size, net, packed } = this.form.getRawValue();
    return { size, net, packed: isoDateOf(packed) ?? '' };
  }
}
