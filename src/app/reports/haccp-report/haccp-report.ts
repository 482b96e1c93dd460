import { ChangeDetectionStrategy, Component, computed } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatAnchor } from '@angular/material/button';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { lastThirtyDays, periodProblem, reportUrl, type ReportPeriod } from '../report-period';

/**
 * The HACCP records report for admins and reviewers: a period, then the PDF or the CSV, which
 * the browser downloads straight from the API (the session signs the request).
 */
@Component({
  selector: 'app-haccp-report',
  imports: [ReactiveFormsModule, MatFormField, MatLabel, MatHint, MatInput, MatAnchor, MatIcon],
  templateUrl: './haccp-report.html',
  styleUrl: './haccp-report.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class HaccpReport {
  private readonly initial = lastThirtyDays();
  protected readonly form = new FormGroup({
    from: new FormControl(this.initial.from, { nonNullable: true }),
    to: new FormControl(this.initial.to, { nonNullable: true }),
  });
  private readonly period = toSignal(this.form.valueChanges, { initialValue: this.initial });
  private readonly chosen = computed<ReportPeriod>(() => ({
    from: this.period().from ?? '',
    to: this.period().to ?? '',
  }));
  protected readonly problem = computed(() => periodProblem(this.chosen()));
  protected readonly pdfUrl = computed(() => reportUrl('pdf', this.chosen()));
  protected readonly csvUrl = computed(() => reportUrl('csv', this.chosen()));
}
