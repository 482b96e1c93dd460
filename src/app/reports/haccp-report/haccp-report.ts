import { ChangeDetectionStrategy, Component, computed } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatAnchor } from '@angular/material/button';
import { MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { DAY_INPUT_IMPORTS, provideDayInputs } from '../../ui/batch-sheet/day-input-formats';
import { isoDateOf, localDateOf } from '../../ui/batch-sheet/iso-day-pipe';
import { lastThirtyDays, periodProblem, reportUrl, type ReportPeriod } from '../report-period';

/**
 * The HACCP records report for admins and reviewers: a period, then the PDF or the CSV, which
 * the browser downloads straight from the API (the session signs the request).
 */
@Component({
  selector: 'app-haccp-report',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatLabel,
    MatHint,
    MatSuffix,
    MatInput,
    DAY_INPUT_IMPORTS,
    MatAnchor,
    MatIcon,
  ],
  providers: [provideDayInputs()],
  templateUrl: './haccp-report.html',
  styleUrl: './haccp-report.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class HaccpReport {
  private readonly initial = lastThirtyDays();
  protected readonly form = new FormGroup({
    from: new FormControl<Date | null>(localDateOf(this.initial.from)),
    to: new FormControl<Date | null>(localDateOf(this.initial.to)),
  });
  private readonly period = toSignal(this.form.valueChanges, {
    initialValue: this.form.getRawValue(),
  });
  /** The period as days YYYY-MM-DD; a box left empty, or not a day, is ''. */
  private readonly chosen = computed<ReportPeriod>(() => ({
    from: isoDateOf(this.period().from ?? null) ?? '',
    to: isoDateOf(this.period().to ?? null) ?? '',
  }));
  protected readonly problem = computed(() => periodProblem(this.chosen()));
  protected readonly pdfUrl = computed(() => reportUrl('pdf', this.chosen()));
  protected readonly csvUrl = computed(() => reportUrl('csv', this.chosen()));
}
